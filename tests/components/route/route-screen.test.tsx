import { act, render, screen } from '@testing-library/react-native';
import { BridgingCandidates } from '@/components/route/bridging-candidates';
import { MarcusPanel } from '@/components/route/marcus-panel';
import { RouteScreen } from '@/components/route/route-screen';
import { predictRoute } from '@/lib/chem/route';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

// Candlin, Halpern & Trimm, J. Am. Chem. Soc. 1964, 86, 1019: [Co(NH3)5Cl]2+ + Cr(II) bridged through Cl.

describe('BridgingCandidates', () => {
  it('lists the bridge on the complex first and installable ones apart, marked', () => {
    render(<BridgingCandidates candidates={predictRoute('[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+').bridgingCandidates} />);
    expect(screen.getByTestId('candidate-0')).toHaveTextContent(/chlorido[\s\S]*on the complex/);
    expect(screen.getByTestId('candidates-installable')).toHaveTextContent(/Could be installed instead \(not on the complex\)/);
    expect(screen.getByTestId('candidate-installable-0')).toHaveTextContent(/could be installed/);
    expect(screen.queryByTestId('candidate-1')).toBeNull();
  });

  it('says so when nothing on the complex can bridge ([Co(NH3)6]3+: Endicott & Taube 1964, outer-sphere)', () => {
    render(<BridgingCandidates candidates={predictRoute('[Co(NH3)6]3+', '[Cr(H2O)6]2+').bridgingCandidates} />);
    expect(screen.getByTestId('candidates-none-present')).toBeTruthy();
  });
});

describe('RouteScreen with a pair given the wrong way round', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('swaps the fields once and says it once', async () => {
    render(<RouteScreen initialOxidant="[Cr(H2O)6]2+" initialReductant="[Co(NH3)5Cl]2+" />);
    await act(async () => {
      jest.advanceTimersByTime(500);
    });
    expect(screen.getByTestId('oxidant-input').props.value).toBe('[Co(NH3)5Cl]2+');
    expect(screen.getByTestId('reductant-input').props.value).toBe('[Cr(H2O)6]2+');
    expect(screen.getAllByText(/Order reversed/)).toHaveLength(1);
    expect(screen.getByTestId('roles-swapped')).toHaveTextContent(/fields have been swapped/);
  });
});

describe('MarcusPanel messages match what is shown', () => {
  // Fe(H2O)6 3+/2+ self-exchange k11 = 4.0 M⁻¹ s⁻¹ (Silverman & Dodson, J. Phys. Chem. 1952, 56, 846);
  // Ru(bpy)3 3+/2+ k22 ≈ 4.2e8 M⁻¹ s⁻¹ and ΔE° = 1.26 − 0.771 V (electron-transfer reference notes, section a).
  const filled = { k11: '4', k22: '4.2e8', dE: '0.489', T: '25', observed: '' };
  const none = ['No Marcus estimate: no self-exchange constant and potential for [X] in the couples table.'];

  it('with an estimate in the fields, no "no estimate" note sits under it', async () => {
    render(<MarcusPanel prefill={filled} sourceNotes={none} tableEstimate={false} />);
    expect(await screen.findByTestId('marcus-result')).toBeTruthy();
    expect(screen.queryByText(/No Marcus estimate/)).toBeNull();
    expect(screen.getByTestId('marcus-own-values')).toHaveTextContent(/values in the fields above/);
  });

  it('without an estimate, the reason is shown', async () => {
    render(<MarcusPanel prefill={{ k11: '', k22: '', dE: '', T: '25', observed: '' }} sourceNotes={none} tableEstimate={false} />);
    expect(await screen.findByText(/No Marcus estimate/)).toBeTruthy();
    expect(screen.queryByTestId('marcus-result')).toBeNull();
  });
});
