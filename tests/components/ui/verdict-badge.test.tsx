import { render, screen } from '@testing-library/react-native';

import { StatusPill, VerdictBadge, type ReviewStatus } from '@/components/ui/verdict-badge';
import { verdictColors } from '@/components/ui/theme';

import { hostName } from '../svg-text';

describe('VerdictBadge', () => {
  it.each(['labile', 'intermediate', 'inert'] as const)('shows the word and its own glyph for %s', (verdict) => {
    render(<VerdictBadge verdict={verdict} />);
    expect(screen.getByText(verdict)).toBeTruthy();
    expect(screen.getByTestId(`verdict-glyph-${verdict}`)).toBeTruthy();
    expect(screen.getByLabelText(`Verdict: ${verdict}`)).toBeTruthy();
  });

  it('uses the verdict colours for the frame', () => {
    render(<VerdictBadge verdict="inert" size="sm" />);
    const badge = screen.getByTestId('verdict-badge');
    expect(badge).toHaveStyle({ backgroundColor: verdictColors.inert.bg, borderColor: verdictColors.inert.fg });
  });

  it('draws a closed ring only for inert', () => {
    const { rerender } = render(<VerdictBadge verdict="inert" />);
    // Closed ring = a Circle outline; the open rings are Paths (arcs with a gap).
    const inertCircles = screen.getByTestId('verdict-glyph-inert').findAll((n) => hostName(n) === 'RNSVGCircle');
    expect(inertCircles).toHaveLength(2);
    rerender(<VerdictBadge verdict="labile" />);
    expect(screen.getByTestId('verdict-glyph-labile').findAll((n) => hostName(n) === 'RNSVGCircle')).toHaveLength(0);
  });
});

describe('StatusPill', () => {
  const cases: [ReviewStatus, string][] = [
    ['draft', 'Draft'],
    ['in-review', 'In review'],
    ['accepted', 'Accepted'],
    ['returned', 'Returned'],
    ['declined', 'Declined'],
    ['retired', 'Retired'],
  ];
  it.each(cases)('%s reads "%s"', (status, word) => {
    render(<StatusPill status={status} />);
    expect(screen.getByText(word)).toBeTruthy();
    expect(screen.getByLabelText(`Status: ${word}`)).toBeTruthy();
    expect(screen.getByTestId(`status-glyph-${status}`)).toBeTruthy();
  });

  it('tells draft from in-review by outline, not colour alone', () => {
    const { rerender } = render(<StatusPill status="draft" />);
    expect(screen.getByTestId('status-pill-draft')).toHaveStyle({ borderStyle: 'dashed' });
    rerender(<StatusPill status="in-review" />);
    expect(screen.getByTestId('status-pill-in-review')).toHaveStyle({ borderStyle: 'dotted' });
    rerender(<StatusPill status="retired" />);
    expect(screen.getByText('Retired')).toHaveStyle({ textDecorationLine: 'line-through' });
  });
});

describe('VerdictBadge definition', () => {
  it('carries the band definition for assistive technology (labile: under a minute, Taube 1952)', () => {
    render(<VerdictBadge verdict="labile" />);
    expect(screen.getByLabelText('Verdict: labile').props.accessibilityHint).toMatch(/under a minute/);
  });
});
