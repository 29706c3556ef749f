import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);
const root = path.resolve(__dirname, '../..');

/** The stable CLI contract of PRODUCT.md, driven as a user (or a script) would. */
async function cli(...args: string[]) {
  try {
    const { stdout, stderr } = await run(process.execPath, [require.resolve('tsx/cli'), 'server/cli.ts', ...args], {
      cwd: root,
    });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const failed = error as { code: number; stdout: string; stderr: string };
    return { code: failed.code, stdout: failed.stdout, stderr: failed.stderr };
  }
}

const jsonLines = (stdout: string) => stdout.trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);

it('classify --json prints one object per formula, in order, with an error line for the bad one', async () => {
  const { code, stdout } = await cli('classify', '--json', '[Cr(H2O)6]3+', '[Co(NH3)6', 'K3[Fe(CN)6]');
  expect(code).toBe(0);
  const lines = jsonLines(stdout);
  expect(lines).toHaveLength(3);
  // [Cr(H2O)6]3+: d3, inert (Helm & Merbach 2005); K3[Fe(CN)6]: Fe(III) d5 low spin (common practice).
  expect(lines[0]).toMatchObject({ formula: '[Cr(H2O)6]3+', metal: 'Cr', oxidationState: 3, dElectrons: 3, verdict: 'inert' });
  expect(lines[1]).toMatchObject({ formula: '[Co(NH3)6', position: 0 });
  expect(typeof lines[1]?.error).toBe('string');
  expect(lines[2]).toMatchObject({ metal: 'Fe', oxidationState: 3, dElectrons: 5, spinState: 'low' });
  for (const key of ['formula', 'metal', 'oxidationState', 'dElectrons', 'spinState', 'geometry', 'verdict', 'reasons', 'cautions']) {
    expect(lines[0]).toHaveProperty(key);
  }
}, 30_000);

it('classify --csv reads a formula column and writes CSV', async () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-cli-'));
  const file = path.join(dir, 'batch.csv');
  fs.writeFileSync(file, 'formula,note\n[Ni(H2O)6]2+,aqua\n"[Co(NH3)5Cl]Cl2",purple\n[Xx(H2O)6]2+,typo\n');
  try {
    const { code, stdout } = await cli('classify', '--csv', file);
    expect(code).toBe(0);
    const [header, ...rows] = stdout.trim().split('\n');
    expect(header?.split(',')).toEqual(expect.arrayContaining(['formula', 'metal', 'verdict', 'error']));
    expect(rows).toHaveLength(3);
    expect(rows[0]).toMatch(/^\[Ni\(H2O\)6\]2\+,Ni,2,8,/);
    expect(rows[2]).toMatch(/character/);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}, 30_000);

it('route --json prints one object per pair with route, reasons and ranked bridging candidates', async () => {
  const { code, stdout } = await cli('route', '--json', '[Co(NH3)5Br]2+', '[Cr(H2O)6]2+', '[Co(NH3)6]3+', '[Cr(H2O)6]2+');
  expect(code).toBe(0);
  const [bridged, outer] = jsonLines(stdout);
  expect(bridged).toMatchObject({ route: 'inner-sphere' });
  expect(outer).toMatchObject({ route: 'outer-sphere' });
  const candidates = bridged?.bridgingCandidates as { ligand: string; donorAtom: string; score: number }[];
  expect(candidates[0]).toEqual(expect.objectContaining({ ligand: expect.any(String), donorAtom: expect.any(String), score: expect.any(Number) }));
}, 30_000);

it('marcus --json computes k12, f12 and K12; bad input exits 2 with a message', async () => {
  // Identity check of the cross relation: K12 = 1, k11 = k22 ⇒ k12 = k11 (Marcus; SCIENCE.md).
  const ok = await cli('marcus', '--json', '--k11', '3e3', '--k22', '3e3', '--K12', '1');
  expect(ok.code).toBe(0);
  const [result] = jsonLines(ok.stdout);
  expect(result?.k12).toBeCloseTo(3e3, 6);
  expect(result).toHaveProperty('f12');
  expect(result).toHaveProperty('K12');

  const bad = await cli('marcus', '--json', '--k11', '-5', '--k22', '3e3', '--dE', '0.2');
  expect(bad.code).toBe(2);
  expect(bad.stderr).toMatch(/k11/);
}, 30_000);

it('formation --json prints {kf, Kos, kex, reasons, published} for a metal complex and an entering ligand', async () => {
  const { code, stdout } = await cli('formation', '--json', '[Ni(H2O)6]2+', 'bpy', '--I', '0.1');
  expect(code).toBe(0);
  const [answer] = jsonLines(stdout);
  // Published k_f = 1.6e3 M⁻¹ s⁻¹ (Holyer, Hubbard, Kettle & Wilkins, Inorg. Chem. 1965, recalled): within ×10.
  expect((answer?.kf as number) / 1.6e3).toBeLessThan(10);
  expect((answer?.kf as number) / 1.6e3).toBeGreaterThan(0.1);
  expect(answer).toEqual(expect.objectContaining({ Kos: expect.any(Number), kex: expect.any(Number), reasons: expect.any(Array), published: expect.objectContaining({ kf: 1.6e3 }) }));
});

it('formation with an unknown ligand exits 2 and says which ligand', async () => {
  const { code, stderr } = await cli('formation', '[Ni(H2O)6]2+', 'XYZ');
  expect(code).toBe(2);
  expect(stderr).toMatch(/XYZ/);
});

it('sequence --json prints {steps, product, isomer}: [PtCl4]2- + NO2⁻ then NH3 gives the trans isomer (Basolo & Pearson 1967)', async () => {
  const { code, stdout } = await cli('sequence', '--json', '[PtCl4]2-', 'NO2', 'NH3');
  expect(code).toBe(0);
  const [answer] = jsonLines(stdout);
  expect(answer?.isomer).toBe('trans');
  expect(answer?.steps).toEqual([
    expect.objectContaining({ entering: 'NO2', leaving: 'Cl', isomer: null, reasons: expect.any(Array) }),
    expect.objectContaining({ entering: 'NH3', leaving: 'Cl', isomer: 'trans', reasons: expect.any(Array) }),
  ]);
});
