import fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { classifyMany } from '@/lib/chem/classify';
import { romanNumeral } from '@/lib/chem/metal-ions';
import { formatPowerOfTen, formatScientific } from '@/lib/chem/number-format';
import { formulaProblemText } from '@/lib/chem/types';
import { predictRoutes } from '@/lib/chem/route';
import { formationRequestSchema, marcusRequestSchema, sequenceRequestSchema } from '@/lib/schemas/chem';
import { formation, marcus, sequence } from '@/server/modules/chem/chem.service';
import { AppError } from '@/server/http/errors';

const USAGE = `Sphereline command line

  npm run --silent cli -- classify [--json] [--T <°C>] <formula> [<formula> …]
  npm run --silent cli -- classify --csv <file.csv> [--T <°C>]     (column "formula", or one per line; CSV out)
  npm run --silent cli -- route [--json] <oxidant> <reductant> [<oxidant> <reductant> …]
  npm run --silent cli -- marcus [--json] --k11 <M-1 s-1> --k22 <M-1 s-1> (--dE <V> | --K12 <n>)
                                 [--T <°C>] [--observed <M-1 s-1>]
  npm run --silent cli -- formation [--json] <metal complex> <entering ligand> [--I <M>] [--T <°C>] [--a <Å>]
        Eigen–Wilkins formation rate: {kf (M-1 s-1), Kos (M-1), kex (s-1), reasons[], published?}
        e.g. formation --json '[Ni(H2O)6]2+' NH3 --I 0.1
  npm run --silent cli -- sequence [--json] <start complex> <ligand> [<ligand> …]
        square-planar d8 substitution step by step (trans effect): {steps: [{entering, leaving, product,
        isomer, reasons[]}], product, isomer}; write cis-/trans- before a start complex that has both,
        e.g. sequence --json '[PtCl4]2-' NH3 NH3

With --json each answer is one JSON object per line, in order; a formula that cannot be read gives
{"formula": …, "error": …, "position": …} on its line and the others still run.`;

class UsageError extends Error {}

interface ParsedArgs {
  flags: Map<string, string | true>;
  positional: string[];
}

const VALUE_FLAGS = new Set(['--T', '--csv', '--k11', '--k22', '--dE', '--K12', '--observed', '--I', '--a']);

function parseArgs(argv: string[]): ParsedArgs {
  const flags = new Map<string, string | true>();
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i] as string;
    if (arg === '--') {
      positional.push(...argv.slice(i + 1));
      break;
    }
    if (VALUE_FLAGS.has(arg)) {
      const value = argv[i + 1];
      if (value === undefined) throw new UsageError(`${arg} needs a value.`);
      flags.set(arg, value);
      i += 1;
    } else if (arg === '--json' || arg === '--help' || arg === '-h') {
      flags.set(arg, true);
    } else if (arg.startsWith('--') && !/^--?\d/.test(arg)) {
      throw new UsageError(`Unknown option ${arg}.`);
    } else {
      positional.push(arg);
    }
  }
  return { flags, positional };
}

function numberFlag(flags: Map<string, string | true>, name: string): number | undefined {
  const raw = flags.get(name);
  if (raw === undefined || raw === true) return undefined;
  const value = Number(raw);
  if (!Number.isFinite(value)) throw new UsageError(`${name} must be a number (got "${raw}").`);
  return value;
}

const print = (line: string) => process.stdout.write(`${line}\n`);

function readCsvFormulas(file: string): string[] {
  if (!fs.existsSync(file)) throw new UsageError(`No such file: ${file}`);
  const rows = parse(fs.readFileSync(file, 'utf8'), { skip_empty_lines: true, relax_column_count: true, trim: true, bom: true }) as string[][];
  const header = rows[0]?.map((cell) => cell.toLowerCase()) ?? [];
  const column = header.indexOf('formula');
  if (column >= 0) return rows.slice(1).map((row) => row[column] ?? '');
  return rows.map((row) => row[0] ?? '');
}

function classifyCommand({ flags, positional }: ParsedArgs) {
  const temperatureC = numberFlag(flags, '--T');
  const csvFile = flags.get('--csv');
  const formulas = typeof csvFile === 'string' ? readCsvFormulas(csvFile) : positional;
  if (formulas.length === 0) throw new UsageError('classify needs at least one formula.');
  const results = classifyMany(formulas, { temperatureC });
  if (typeof csvFile === 'string') {
    const columns = ['formula', 'metal', 'oxidationState', 'dElectrons', 'spinState', 'geometry', 'verdict', 'logKPerSecond', 'halfLifeSeconds', 'confidence', 'decidedBy', 'molarMassGPerMol', 'error'];
    const rows = results.map((result) =>
      'error' in result
        ? { formula: result.formula, error: formulaProblemText(result.error, result.position) }
        : { ...result, error: '' },
    );
    process.stdout.write(stringify(rows, { header: true, columns }));
    return;
  }
  for (const result of results) {
    if (flags.has('--json')) {
      print(JSON.stringify(result));
    } else if ('error' in result) {
      print(`${result.formula}\n  cannot be read: ${formulaProblemText(result.error, result.position)}\n`);
    } else {
      print(
        `${result.formula}\n  ${result.metal}(${romanNumeral(result.oxidationState)}) d${result.dElectrons}` +
          `${result.spinState ? ` ${result.spinState} spin` : ''}, ${result.geometry}: ${result.verdict.toUpperCase()}` +
          ` (k ≈ ${formatPowerOfTen(result.logKPerSecond)} s⁻¹, ${result.decidedBy})\n` +
          result.reasons.map((reason) => `   - ${reason}`).join('\n') +
          `\n  Mechanism: ${result.mechanism.class} (${result.mechanism.evidence === 'measured' ? 'measured' : 'from the trend'}, ${result.mechanism.confidence} confidence)\n` +
          [...result.mechanism.reasons, ...(result.mechanism.assistedPaths ?? []).map((path) => `${path.text} (${path.rateLaw})`)].map((reason) => `   - ${reason}`).join('\n') +
          (result.cautions.length ? `\n  Cautions:\n${result.cautions.map((c) => `   ! ${c}`).join('\n')}` : '') +
          '\n',
      );
    }
  }
}

function routeCommand({ flags, positional }: ParsedArgs) {
  if (positional.length === 0 || positional.length % 2 !== 0) {
    throw new UsageError('route needs pairs of formulas: <oxidant> <reductant> [<oxidant> <reductant> …].');
  }
  const pairs: [string, string][] = [];
  for (let i = 0; i < positional.length; i += 2) pairs.push([positional[i] as string, positional[i + 1] as string]);
  for (const result of predictRoutes(pairs, { temperatureC: numberFlag(flags, '--T') })) {
    if (flags.has('--json')) {
      print(JSON.stringify(result));
    } else if ('error' in result) {
      print(`${result.oxidant} + ${result.reductant}\n  cannot be read: ${result.error}\n`);
    } else {
      print(
        `${result.oxidant.formula} + ${result.reductant.formula}: ${result.route.toUpperCase()}\n` +
          result.reasons.map((reason) => `   - ${reason}`).join('\n') +
          `\n  Bridging candidates: ${result.bridgingCandidates.slice(0, 5).map((c) => `${c.ligand} (${c.donorAtom}, ${c.score})`).join(', ') || 'none'}` +
          `\n  Expected products: ${result.expectedProducts.join('; ')}\n`,
      );
    }
  }
}

function marcusCommand({ flags }: ParsedArgs) {
  const request = marcusRequestSchema.safeParse({
    k11: numberFlag(flags, '--k11'),
    k22: numberFlag(flags, '--k22'),
    dE: numberFlag(flags, '--dE'),
    K12: numberFlag(flags, '--K12'),
    T: numberFlag(flags, '--T'),
    observed: numberFlag(flags, '--observed'),
  });
  if (!request.success) {
    const issue = request.error.issues[0];
    throw new UsageError(`--${issue?.path.join('.') || 'input'}: ${issue?.message ?? 'invalid'}`);
  }
  const result = marcus(request.data);
  if (flags.has('--json')) {
    print(JSON.stringify(result));
    return;
  }
  print(
    `k12 = ${formatScientific(result.k12, 3)} M⁻¹ s⁻¹   (K12 = ${formatScientific(result.K12, 3)}, f12 = ${formatScientific(result.f12, 3)})` +
      (result.comparison ? `\n${result.comparison.explanation}` : ''),
  );
}

function formationCommand({ flags, positional }: ParsedArgs) {
  if (positional.length !== 2) throw new UsageError('formation needs a metal complex and an entering ligand, e.g. formation \'[Ni(H2O)6]2+\' NH3.');
  const request = formationRequestSchema.safeParse({
    complex: positional[0],
    ligand: positional[1],
    I: numberFlag(flags, '--I'),
    T: numberFlag(flags, '--T'),
    a: numberFlag(flags, '--a'),
  });
  if (!request.success) {
    const issue = request.error.issues[0];
    const field = String(issue?.path[0] ?? 'input');
    throw new UsageError(`${field === 'complex' || field === 'ligand' ? field : `--${field}`}: ${issue?.message ?? 'invalid'}`);
  }
  const result = formation(request.data);
  if (flags.has('--json')) {
    print(JSON.stringify(result));
    return;
  }
  print(
    `${result.complex} + ${result.ligand}: k_f ≈ ${result.kf.toExponential(2)} M⁻¹ s⁻¹   (K_os = ${result.Kos.toPrecision(3)} M⁻¹, k_ex = ${result.kex.toExponential(2)} s⁻¹)\n` +
      result.reasons.map((reason) => `   - ${reason}`).join('\n'),
  );
}

function sequenceCommand({ flags, positional }: ParsedArgs) {
  const [start, ...ligands] = positional;
  const request = sequenceRequestSchema.safeParse({ start, ligands });
  if (!request.success) {
    const issue = request.error.issues[0];
    throw new UsageError(`${issue?.path.join('.') || 'input'}: ${issue?.message ?? 'invalid'} (sequence needs a start complex and at least one entering ligand)`);
  }
  const result = sequence(request.data);
  if (flags.has('--json')) {
    print(JSON.stringify(result));
    return;
  }
  print(`${result.start.productLabel}`);
  for (const step of result.steps) {
    print(`  + ${step.entering}, − ${step.leaving} → ${step.productLabel}\n${step.reasons.map((reason) => `     - ${reason}`).join('\n')}`);
  }
  print(`Product: ${result.productLabel}\n${result.notes.map((note) => `   · ${note}`).join('\n')}`);
}

function main(argv: string[]): number {
  const [command, ...rest] = argv;
  try {
    const args = parseArgs(rest);
    if (!command || command === 'help' || args.flags.has('--help') || args.flags.has('-h')) {
      print(USAGE);
      return command ? 0 : 2;
    }
    if (command === 'classify') classifyCommand(args);
    else if (command === 'route') routeCommand(args);
    else if (command === 'marcus') marcusCommand(args);
    else if (command === 'formation') formationCommand(args);
    else if (command === 'sequence') sequenceCommand(args);
    else throw new UsageError(`Unknown command "${command}".`);
    return 0;
  } catch (error) {
    if (error instanceof UsageError) {
      process.stderr.write(`${error.message}\n\n${USAGE}\n`);
      return 2;
    }
    if (error instanceof AppError) {
      process.stderr.write(`${error.message}\n`);
      if (argv.includes('--json')) print(JSON.stringify({ error: error.message, fields: error.fields ?? {} }));
      return 2;
    }
    throw error;
  }
}

process.exitCode = main(process.argv.slice(2));
