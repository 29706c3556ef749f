import { classifyFormula } from '@/lib/chem/classify';
for (const f of process.argv.slice(2)) {
  try { const c = classifyFormula(f); const m = c.mechanism; console.log(f, m.class, m.evidence, m.activationVolume ?? '', m.confidence, m.intermediateCoordination, '\n   ' + m.reasons.join('\n   ') + (m.assistedPaths ? '\n   >> ' + m.assistedPaths.map(p=>p.rateLaw+' | '+p.text).join('\n   >> ') : '')); }
  catch (e) { console.log(f, 'ERR', (e as Error).message); }
}
