import { render, screen, within } from '@testing-library/react-native';
import { VerdictCard } from '@/components/check/result-cards';
import { ComplexDetailView } from '@/components/library/complex-detail';
import { classifyFormula } from '@/lib/chem/classify';
import { decideByLibrary } from '@/lib/chem/library-decision';
import { mockFetch, renderWithQueries } from '../account/test-kit';
import { contributorMe, curatorMe, detail } from './library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

/**
 * Measured decides on screen: the accepted measurement is the headline (entry and citation), the
 * model's prediction the footnote; curators see a flag beyond two log units.
 */

// Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45: [Rh(H2O)6]3+ k_ex = 2.2e-9 s⁻¹ at 298 K.
const rhCitation = { authors: 'G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach', title: null, journal: 'Magn. Reson. Chem.', year: 1991, volume: '29', pages: 'S45-S51', doi: '10.1002/mrc.1260291311' };

describe('VerdictCard decided by the library', () => {
  it('shows the entry and its citation as the headline and the model as the footnote', () => {
    const model = classifyFormula('[Rh(H2O)6]3+');
    const decided = decideByLibrary(model, { entryId: 'c-rh', entryName: 'hexaaquarhodium(III)', entryFormula: '[Rh(H2O)6]3+', kind: 'water-exchange', kPerSecond: 2.2e-9, temperatureK: 298.15, citation: rhCitation });
    render(<VerdictCard result={decided} />);
    expect(screen.getByTestId('verdict-confidence')).toHaveTextContent('decided by your group’s measurement');
    const headline = screen.getByTestId('verdict-headline');
    expect(headline).toHaveTextContent(/hexaaquarhodium\(III\)/);
    expect(headline).toHaveTextContent(/2\.2 × 10⁻⁹ s⁻¹ at 25 °C/);
    expect(screen.getByTestId('verdict-headline-citation')).toHaveTextContent('G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach, Magn. Reson. Chem. 1991, 29, S45-S51');
    // t½ = ln 2 / 2.2e-9 s ≈ 3.2e8 s ≈ 10 years ("y" on the duration ladder).
    expect(screen.getByTestId('verdict-rate')).toHaveTextContent(/t½ ≈ 10 y at 25 °C/);
    expect(screen.getByTestId('verdict-model-footnote')).toHaveTextContent(/Model’s prediction \(footnote\)/);
    expect(within(screen.getByTestId('verdict-model-reasons')).getAllByText(/./).length).toBeGreaterThan(0);
  });

  it('a prediction alone has no headline and no footnote', () => {
    render(<VerdictCard result={classifyFormula('[Co(NH3)5Cl]2+')} />);
    expect(screen.queryByTestId('verdict-headline')).toBeNull();
    expect(screen.queryByTestId('verdict-model-footnote')).toBeNull();
  });
});

describe('the entry page', () => {
  const revisions = { 'GET /api/complexes/c-cr-aqua/revisions': { status: 200, body: { revisions: [] } } };

  it('an accepted entry’s measured rate decides its verdict; the model is the footnote; no flag within two log units', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/complexes/c-cr-aqua': { status: 200, body: detail({ status: 'accepted', myRole: 'curator' }) },
      ...revisions,
    });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    // 2.4e-6 s⁻¹ (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
    const headline = await screen.findByTestId('verdict-headline');
    expect(headline).toHaveTextContent(/hexaaquachromium\(III\)/);
    expect(screen.getByTestId('verdict-headline-citation')).toHaveTextContent(/Inorg\. Chem\. 1985, 24, 267-270/);
    expect(screen.getByTestId('complex-decided-by')).toBeTruthy();
    expect(screen.getByTestId('verdict-model-footnote')).toBeTruthy();
    expect(screen.queryByTestId('complex-second-look')).toBeNull();
  });

  it('a draft’s measurement does not decide', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes/c-cr-aqua': { status: 200, body: detail() },
      ...revisions,
    });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    await screen.findByTestId('complex-engine');
    expect(screen.queryByTestId('verdict-headline')).toBeNull();
    expect(screen.getByTestId('verdict-confidence')).not.toHaveTextContent(/your group/);
  });

  it('curators see a second-look flag when measurement and model differ by more than two log units; contributors do not', async () => {
    // A unit slip: 2.4 s⁻¹ typed for 2.4e-6 s⁻¹ puts the value six log units from the published one.
    const slipped = detail({ status: 'accepted', myRole: 'curator' });
    slipped.measurements = slipped.measurements.map((m) => ({ ...m, value: 2.4 }));
    mockFetch({ 'GET /api/auth/me': { status: 200, body: curatorMe }, 'GET /api/complexes/c-cr-aqua': { status: 200, body: slipped }, ...revisions });
    const curatorView = renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    expect(await screen.findByTestId('complex-second-look')).toHaveTextContent(/second look/);
    curatorView.unmount();

    mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe }, 'GET /api/complexes/c-cr-aqua': { status: 200, body: { ...slipped, myRole: 'contributor' } }, ...revisions });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    await screen.findByTestId('verdict-headline');
    expect(screen.queryByTestId('complex-second-look')).toBeNull();
  });
});

describe('VerdictCard where the model is weak', () => {
  it('[Cr(CO)6] (18-electron carbonyl): a half-life range and "order of magnitude only", never "t½ ≈"', () => {
    render(<VerdictCard result={classifyFormula('[Cr(CO)6]')} />);
    const rate = screen.getByTestId('verdict-rate');
    expect(rate).toHaveTextContent(/t½ .+ to .+/);
    expect(rate).not.toHaveTextContent(/t½ ≈/);
    expect(screen.getByTestId('verdict-rate-range-note')).toHaveTextContent(/order of magnitude only/);
    expect(screen.getByTestId('verdict-confidence')).toHaveTextContent(/low confidence/);
  });
});
