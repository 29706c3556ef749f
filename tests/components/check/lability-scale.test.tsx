import { fireEvent, render, screen } from '@testing-library/react-native';

import { LabilityScale } from '@/components/check/lability-scale';

import { svgTexts } from '../svg-text';

const x1 = (testID: string): number => Number(screen.getByTestId(testID).props.x1);

// The one-minute line sits at k = ln2/60 s⁻¹, log k ≈ −1.94 (Taube, Chem. Rev. 1952, 50, 69, as
// restated in the science notes). Water-exchange values below are from water_exchange.json
// (Helm & Merbach 2005): [Cr(H2O)6]3+ k = 2.4e-6 s⁻¹ (log −5.6), [Ni(H2O)6]2+ 3.2e4 (log 4.5),
// [Fe(H2O)6]3+ 1.6e2 (log 2.2), [Rh(H2O)6]3+ 2.2e-9 (log −8.7), [V(H2O)6]3+ 5.0e2 (log 2.7).
// [Co(NH3)6]3+ at log −5.3 is only a placeholder position for a predicted entry (no check value).
describe('LabilityScale', () => {
  it('places an inert complex left of the one-minute line and a labile one right of it', () => {
    const { rerender } = render(<LabilityScale logK={-5.6} verdict="inert" label="[Cr(H₂O)₆]³⁺" />);
    expect(x1('lability-marker-stem')).toBeLessThan(x1('one-minute-line'));
    rerender(<LabilityScale logK={4.5} verdict="labile" label="[Ni(H₂O)₆]²⁺" />);
    expect(x1('lability-marker-stem')).toBeGreaterThan(x1('one-minute-line'));
  });

  it('puts the one-minute line at log k ≈ −1.94 on a −10…10 axis (340 px wide, 26 px margins)', () => {
    render(<LabilityScale logK={0} verdict="labile" label="x" />);
    // Hand arithmetic: 26 + (−1.94 + 10) / 20 × (340 − 52) = 142.1 px.
    expect(x1('one-minute-line')).toBeCloseTo(142.1, 0);
    expect(x1('lability-marker-stem')).toBeCloseTo(170, 5); // log k 0 is the midpoint
  });

  it('describes itself for screen readers', () => {
    render(<LabilityScale logK={3.2} verdict="labile" label="[Cu(en)₂]²⁺" />);
    // 10^3.2 = 1585 s⁻¹ → "1600" at two significant figures; the one-minute line k = ln 2 / 60 s = 0.01155 s⁻¹
    // (Taube, Chem. Rev. 1952, 50, 69) → "0.012" (notation: common practice, two significant figures).
    expect(screen.getByLabelText('[Cu(en)₂]²⁺: k ≈ 1600 s⁻¹, labile; one-minute line at k ≈ 0.012 s⁻¹')).toBeTruthy();
  });

  it('labels the decades with powers of ten and marks the one-minute line', () => {
    render(<LabilityScale logK={-5.6} verdict="inert" label="[Cr(H₂O)₆]³⁺" />);
    const texts = svgTexts(screen.getByTestId('lability-scale'));
    const decadeLabels = screen.getAllByTestId('decade-label').map((node) => svgTexts(node).join(' '));
    // At the phone width (340 px, 14.4 px per decade) the 12 px labels go every fifth decade so they never touch.
    expect(decadeLabels).toEqual(['10 −10', '10 −5', '10 0', '10 5', '10 10']);
    expect(texts).toEqual(expect.arrayContaining(['t½ = 1 min', 'inert', 'labile', 'k / s⁻¹']));
  });

  it('labels every second decade where there is room, and never sets labels closer than 44 px', () => {
    render(<LabilityScale logK={-5.6} verdict="inert" label="[Cr(H₂O)₆]³⁺" />);
    fireEvent(screen.getByTestId('lability-scale'), 'layout', { nativeEvent: { layout: { width: 760, height: 136 } } });
    const labels = screen.getAllByTestId('decade-label');
    expect(labels.map((node) => svgTexts(node).join(' '))).toEqual(['10 −10', '10 −8', '10 −6', '10 −4', '10 −2', '10 0', '10 2', '10 4', '10 6', '10 8', '10 10']);
    const xs = labels.map((node) => Number(node.props.x));
    for (let i = 1; i < xs.length; i++) expect((xs[i] as number) - (xs[i - 1] as number)).toBeGreaterThanOrEqual(44);
  });

  it('writes every label of the scale at 12 px or more', () => {
    render(<LabilityScale logK={-5.6} verdict="inert" label="[Cr(H₂O)₆]³⁺" neighbours={[{ label: '[V(H₂O)₆]³⁺', logK: 2.7, measured: true }]} />);
    const sizes: number[] = [];
    const visit = (node: { props: Record<string, unknown>; children?: unknown[] }) => {
      if (node.props.fontSize !== undefined) sizes.push(Number(node.props.fontSize));
      for (const child of node.children ?? []) if (typeof child === 'object' && child !== null) visit(child as typeof node);
    };
    visit(screen.getByTestId('lability-scale') as unknown as { props: Record<string, unknown>; children?: unknown[] });
    expect(sizes.length).toBeGreaterThan(5);
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(12);
  });

  it('clamps values off the scale with an arrow', () => {
    const { rerender } = render(<LabilityScale logK={-14} verdict="inert" label="far off" />);
    expect(screen.getAllByTestId('clamp-arrow')).toHaveLength(1);
    expect(x1('lability-marker-stem')).toBeCloseTo(26, 5);
    rerender(<LabilityScale logK={-9} verdict="inert" label="on scale" />);
    expect(screen.queryAllByTestId('clamp-arrow')).toHaveLength(0);
  });

  it('draws neighbours with labels that alternate rows and never overlap in a row', () => {
    const neighbours = [
      { label: '[Cr(H₂O)₆]³⁺', logK: -5.6, measured: true },
      { label: '[Co(NH₃)₆]³⁺', logK: -5.3, measured: false },
      { label: '[Rh(H₂O)₆]³⁺', logK: -8.7, measured: true },
      { label: '[Ni(H₂O)₆]²⁺', logK: 4.5, measured: true },
      { label: '[Fe(H₂O)₆]³⁺', logK: 2.2, measured: true },
    ];
    render(<LabilityScale logK={2.7} verdict="labile" label="[V(H₂O)₆]³⁺" neighbours={neighbours} />);
    expect(screen.getAllByTestId('lability-neighbour')).toHaveLength(5);
    const labels = screen.getAllByTestId('lability-neighbour-label');
    const rows = new Map<number, { from: number; to: number }[]>();
    for (const node of labels) {
      const y = Number(node.props.y);
      const x = Number(node.props.x);
      const half = (svgTexts(node)[0] ?? '').length * 11 * 0.29;
      const row = rows.get(y) ?? [];
      for (const other of row) expect(x - half >= other.to || x + half <= other.from).toBe(true);
      row.push({ from: x - half, to: x + half });
      rows.set(y, row);
    }
    expect(rows.size).toBe(2); // some above, some below
    // The neighbour given as log k −5.6: 10^−5.6 = 2.51 × 10⁻⁶ (hand arithmetic), written a × 10ⁿ to two figures.
    expect(screen.getByLabelText(/nearby: \[Cr\(H₂O\)₆\]³⁺ \(k ≈ 2\.5 × 10⁻⁶ s⁻¹, measured\)/)).toBeTruthy();
  });
});
