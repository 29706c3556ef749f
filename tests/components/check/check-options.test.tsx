import { fireEvent, render, screen } from '@testing-library/react-native';

import { GeometryChoice, TemperatureChoice, temperatureProblem } from '@/components/check/check-options';

describe('TemperatureChoice', () => {
  it('reports a value that is not a number in the field and tells the screen', () => {
    const onChange = jest.fn();
    const onProblem = jest.fn();
    render(<TemperatureChoice valueC={25} onChange={onChange} onProblem={onProblem} />);
    fireEvent.changeText(screen.getByTestId('temperature-input'), 'abc');
    expect(screen.getByTestId('temperature-problem').props.children).toMatch(/not a number/);
    expect(onProblem).toHaveBeenLastCalledWith(expect.stringMatching(/not a number/));
    expect(onChange).not.toHaveBeenCalled();
  });

  it('refuses a temperature outside the range and applies one inside it', () => {
    const onChange = jest.fn();
    render(<TemperatureChoice valueC={25} onChange={onChange} />);
    fireEvent.changeText(screen.getByTestId('temperature-input'), '500');
    expect(screen.getByTestId('temperature-problem').props.children).toMatch(/-80 to 250 °C/);
    expect(onChange).not.toHaveBeenCalled();
    fireEvent.changeText(screen.getByTestId('temperature-input'), '45');
    expect(screen.queryByTestId('temperature-problem')).toBeNull();
    expect(onChange).toHaveBeenLastCalledWith(45);
  });

  it('a preset chip clears the field, so it never shows a value the result is not for', () => {
    const onChange = jest.fn();
    render(<TemperatureChoice valueC={25} onChange={onChange} />);
    fireEvent.changeText(screen.getByTestId('temperature-input'), '500');
    fireEvent.press(screen.getByText('0 °C'));
    expect(screen.getByTestId('temperature-input').props.value).toBe('');
    expect(screen.queryByTestId('temperature-problem')).toBeNull();
    expect(onChange).toHaveBeenLastCalledWith(0);
  });

  it('reads a decimal comma and a minus sign', () => {
    expect(temperatureProblem('37,5')).toBeNull();
    expect(temperatureProblem('−40')).toBeNull();
    expect(temperatureProblem('-90')).toMatch(/from -80/);
  });
});

describe('GeometryChoice', () => {
  it('offers only geometries with room for the complex’s donor atoms (common practice: CN 4 is tetrahedral or square planar)', () => {
    render(<GeometryChoice value={null} predicted="tetrahedral" coordinationNumber={4} onChange={jest.fn()} />);
    expect(screen.getByText('square-planar')).toBeTruthy();
    expect(screen.queryByText('octahedral')).toBeNull();
    expect(screen.queryByText('trigonal-bipyramidal')).toBeNull();
  });

  it('offers no square-planar override for a six-coordinate complex', () => {
    render(<GeometryChoice value={null} predicted="octahedral" coordinationNumber={6} onChange={jest.fn()} />);
    expect(screen.queryByText('square-planar')).toBeNull();
    expect(screen.queryByText('tetrahedral')).toBeNull();
  });
});
