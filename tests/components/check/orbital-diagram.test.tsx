import { render, screen } from '@testing-library/react-native';

import { OrbitalDiagram } from '@/components/check/orbital-diagram';

import { svgTexts } from '../svg-text';

// Configurations written out by hand (common practice: crystal-field aufbau with Hund's rule).
describe('OrbitalDiagram', () => {
  it('d6 low spin: six electrons as three pairs in t2g ([Co(NH3)6]3+)', () => {
    render(<OrbitalDiagram dElectrons={6} geometry="octahedral" spinState="low" deltaOcm={22870} />);
    expect(screen.getAllByTestId('electron-up')).toHaveLength(3);
    expect(screen.getAllByTestId('electron-down')).toHaveLength(3);
    expect(screen.getAllByTestId('orbital-bar')).toHaveLength(5);
    expect(screen.getByLabelText('Octahedral d6 low spin: t2g 6, eg 0')).toBeTruthy();
  });

  it('d6 high spin: five up and one down, one pair ([Fe(H2O)6]2+)', () => {
    render(<OrbitalDiagram dElectrons={6} geometry="octahedral" spinState="high" deltaOcm={null} />);
    expect(screen.getAllByTestId('electron-up')).toHaveLength(5);
    expect(screen.getAllByTestId('electron-down')).toHaveLength(1);
    expect(screen.getByLabelText('Octahedral d6 high spin: t2g 4, eg 2')).toBeTruthy();
  });

  it('shows the Δo value only when it is known', () => {
    const { rerender } = render(<OrbitalDiagram dElectrons={3} geometry="octahedral" spinState={null} deltaOcm={17400} />);
    expect(screen.getByTestId('splitting-arrow')).toBeTruthy();
    // Digits grouped in threes by a thin (narrow no-break) space, never a comma (IUPAC Green Book, 3rd ed. 2007, §1.3).
    expect(svgTexts(screen.getByTestId('splitting-arrow'))).toContain('≈ 17\u202f400 cm⁻¹');
    rerender(<OrbitalDiagram dElectrons={3} geometry="octahedral" spinState={null} deltaOcm={null} />);
    expect(screen.getByTestId('splitting-arrow')).toBeTruthy();
    expect(screen.queryByTestId('splitting-value')).toBeNull();
    expect(screen.getByLabelText('Octahedral d3: t2g 3, eg 0')).toBeTruthy();
  });

  it('tetrahedral d7 uses e and t2 ([CoCl4]2-)', () => {
    render(<OrbitalDiagram dElectrons={7} geometry="tetrahedral" spinState="high" />);
    expect(screen.getAllByTestId('electron-up')).toHaveLength(5);
    expect(screen.getAllByTestId('electron-down')).toHaveLength(2);
    expect(screen.getByLabelText('Tetrahedral d7 high spin: e 4, t2 3')).toBeTruthy();
  });

  it('square-planar d8 draws four levels and leaves dx2−y2 empty', () => {
    render(<OrbitalDiagram dElectrons={8} geometry="square-planar" spinState="low" />);
    expect(screen.getByTestId('orbital-level-dx2-y2')).toBeTruthy();
    expect(screen.getAllByTestId('electron-down')).toHaveLength(4);
    expect(screen.getAllByTestId('electron-up')).toHaveLength(4);
    expect(screen.getByLabelText('Square-planar d8 low spin: dxz,dyz 4, dz2 2, dxy 2, dx2-y2 0')).toBeTruthy();
    expect(screen.queryByTestId('splitting-arrow')).toBeNull();
  });

  it('d10 and other geometries get the neutral five-orbital picture without a barycentre', () => {
    const { rerender } = render(<OrbitalDiagram dElectrons={10} geometry="octahedral" spinState={null} />);
    expect(screen.getAllByTestId('electron-down')).toHaveLength(5);
    expect(screen.queryByTestId('barycentre')).toBeNull();
    expect(screen.getByLabelText('Octahedral d10: five d orbitals shown unsplit, all filled')).toBeTruthy();
    rerender(<OrbitalDiagram dElectrons={0} geometry="tetrahedral" spinState={null} />);
    expect(screen.queryAllByTestId('electron-up')).toHaveLength(0);
    expect(svgTexts(screen.getByTestId('orbital-diagram'))).toContain('five d orbitals, unsplit');
  });
});
