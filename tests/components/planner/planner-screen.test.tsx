import { act, render, screen } from '@testing-library/react-native';
import { PlannerScreen } from '@/components/planner/planner-screen';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

describe('PlannerScreen', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  // Peyrone 1844, as retold by Basolo & Pearson 1967: [PtCl4]2- + 2 NH3 gives cis-[PtCl2(NH3)2].
  it('draws the start and each intermediate, with the entering ligand on each arrow and the cis product', () => {
    render(<PlannerScreen initialStart="[PtCl4]2-" initialLigands="NH3 NH3" />);
    act(() => jest.advanceTimersByTime(300));
    expect(screen.getByTestId('planner-isomer')).toHaveTextContent('cis isomer');
    expect(screen.getByTestId('planner-square-0')).toBeTruthy();
    expect(screen.getByTestId('planner-square-2')).toBeTruthy();
    expect(screen.getByTestId('planner-arrow-1')).toHaveTextContent(/\+ NH₃[\s\S]*− Cl/);
    expect(screen.getByTestId('planner-arrow-2')).toHaveTextContent(/\+ NH₃/);
    // Each step's lines read as sentences, the formulas typeset (one notation on every screen).
    expect(screen.getByTestId('planner-step-1')).toHaveTextContent(/Product: \[PtCl₃\(NH₃\)\]⁻/);
    expect(screen.getByTestId('planner-step-1')).not.toHaveTextContent(/product:/);
  });

  it('asks for cis- or trans- when the start complex has both', () => {
    render(<PlannerScreen initialStart="[PtCl2(NH3)2]" initialLigands="py" />);
    act(() => jest.advanceTimersByTime(300));
    expect(screen.getByText(/write cis-\[PtCl2\(NH3\)2\] or trans-/)).toBeTruthy();
  });
});
