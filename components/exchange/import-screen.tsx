import { useMemo, useState } from 'react';
import { ActivityIndicator, Linking, Platform, StyleSheet, View } from 'react-native';
import { TextLink } from '@/components/account/auth-frame';
import { ErrorBlock, LoadingBlock } from '@/components/account/query-states';
import { useLibraryAccess } from '@/components/library/use-library-access';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { FormError } from '@/components/ui/form-error';
import { FormulaText } from '@/components/ui/formula-text';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { StatusPill } from '@/components/ui/verdict-badge';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { FileRefusedError, isImportFinished, useImportJobQuery, useStartImportMutation, type PickedFile } from '@/lib/api/exchange';
import {
  csvColumns,
  duplicateChoices,
  IMPORT_MAX_BYTES,
  planCsvColumns,
  type CsvColumn,
  type CsvColumnPlan,
  type CsvMapping,
  type DuplicateChoice,
  type ImportIssue,
  type ImportJob,
} from '@/lib/schemas/exchange';
import { roleAtLeast, type Role } from '@/lib/schemas/groups';
import { fileSizeText, importRefusalText } from './exchange-format';
import { FilePickButton } from './file-picker';

/** Which of our columns each header of the file feeds (null: ignored). */
type ColumnChoice = Record<string, CsvColumn | null>;

/** The header line of a CSV file (quotes and doubled quotes honoured), for mapping before the server has read it. */
export function csvHeaderLine(text: string): string[] {
  const line = text.replace(/^\uFEFF/, '');
  const headers: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i += 1) {
    const ch = line[i] as string;
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i += 1;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      headers.push(cell.trim());
      cell = '';
    } else if (ch === '\n' || ch === '\r') break;
    else cell += ch;
  }
  headers.push(cell.trim());
  return headers.filter((header, index) => header !== '' || index < headers.length - 1);
}

/** The person's choices as the server's mapping (our column → their header). */
export function mappingFromChoices(choices: ColumnChoice): CsvMapping {
  const mapping: CsvMapping = {};
  for (const [header, column] of Object.entries(choices)) if (column) mapping[column] = header;
  return mapping;
}

/** /library/import: choose a CSV file, check it (dry run), adjust the columns, then import for review. */
export function ImportScreen() {
  const access = useLibraryAccess();
  if (access.state === 'loading') return <Screen><LoadingBlock label="Checking your groups…" testID="import-loading" /></Screen>;
  if (access.state === 'error') {
    return <Screen><ErrorBlock title="Your groups could not be loaded" error={access.error} onRetry={access.retry} testID="import-access-error" /></Screen>;
  }
  const groups = access.state === 'member' ? access.memberships.filter((m) => roleAtLeast(m.role, 'contributor')) : [];
  if (groups.length === 0) {
    return (
      <Screen maxWidth={720}>
        <View style={styles.section} testID="import-not-allowed">
          <AppText variant="title">Importing needs the contributor role</AppText>
          <AppText tone="soft">
            {access.state === 'signed-out'
              ? 'Sign in to import entries into your group’s library.'
              : 'Contributors, curators and admins of a group can import entries. Ask your group’s admin for the contributor role.'}
          </AppText>
          <TextLink href="/library" testID="import-back">← Library</TextLink>
        </View>
      </Screen>
    );
  }
  return <ImportFlow groups={groups.map((g) => ({ groupId: g.groupId, groupName: g.groupName, role: g.role }))} />;
}

function ImportFlow({ groups }: { groups: { groupId: string; groupName: string; role: Role }[] }) {
  const [file, setFile] = useState<PickedFile | null>(null);
  const [fileHeaders, setFileHeaders] = useState<string[]>([]);
  const [groupId, setGroupId] = useState<string | null>(groups.length === 1 ? (groups[0]?.groupId ?? null) : null);
  const [choices, setChoices] = useState<ColumnChoice>({});
  const [checkedMapping, setCheckedMapping] = useState<string | null>(null);
  const [dryJobId, setDryJobId] = useState<string | null>(null);
  const [runJobId, setRunJobId] = useState<string | null>(null);
  const [duplicatesChoice, setDuplicatesChoice] = useState<DuplicateChoice>('skip');
  const [rowChoices, setRowChoices] = useState<Record<string, DuplicateChoice>>({});
  const start = useStartImportMutation();
  const dryJob = useImportJobQuery(dryJobId);
  const runJob = useImportJobQuery(runJobId);

  const mapping = useMemo(() => mappingFromChoices(choices), [choices]);
  const mappingKey = JSON.stringify(mapping);
  const dry = dryJob.data;
  const dryRunning = !!dryJobId && (!dry || !isImportFinished(dry));
  const dryClean = !!dry && dry.state === 'succeeded' && dry.errorCount === 0 && checkedMapping === mappingKey;
  const run = runJob.data;
  const tooLarge = !!file && file.sizeBytes > IMPORT_MAX_BYTES;

  const clear = () => {
    setFile(null);
    setChoices({});
    setDryJobId(null);
    setRunJobId(null);
    setCheckedMapping(null);
    setFileHeaders([]);
    setDuplicatesChoice('skip');
    setRowChoices({});
    start.reset();
  };

  const pick = (picked: PickedFile) => {
    clear();
    setFile(picked);
    // The header line lets people map columns even when the server refuses the file's headers.
    try {
      void picked.body
        .slice(0, 64 * 1024)
        .text()
        .then((text) => setFileHeaders(csvHeaderLine(text)))
        .catch(() => setFileHeaders([]));
    } catch {
      // No way to read it here: the server's report will name the headers.
    }
  };

  const send = (dryRun: boolean) => {
    if (!file) return;
    start.mutate(
      { file, groupId: groupId ?? undefined, dryRun, mapping, duplicates: duplicatesChoice, duplicateChoices: rowChoices },
      {
        onSuccess: (job) => {
          if (dryRun) {
            setDryJobId(job.id);
            setCheckedMapping(mappingKey);
          } else setRunJobId(job.id);
        },
      },
    );
  };

  // The file's own header line as soon as it is read; the server's list when the browser could not read it.
  const headers = fileHeaders.length > 0 ? fileHeaders : (dry?.columns.map((c) => c.header) ?? []);
  const refusal = start.error;

  if (run) {
    return (
      <Screen maxWidth={880}>
        <ImportHeading />
        <RunStatus
          job={run}
          canReview={roleAtLeast(groups.find((g) => g.groupId === run.groupId)?.role ?? 'viewer', 'curator')}
          onAnother={() => pick(file as PickedFile)}
          onFresh={clear}
        />
      </Screen>
    );
  }

  return (
    <Screen maxWidth={880}>
      <ImportHeading />
      <Card title="1 · The file">
        <AppText tone="soft">
          One row per measurement, with a header row. Sphereline reads columns such as formula, name, kind, value, unit, temperature_K,
          medium, method and the citation (doi, authors, journal, year…). Rows with the same formula and name become one entry. At most 5 MB.
        </AppText>
        <AppText
          {...{ href: '/api/imports/template.csv', hrefAttrs: { download: true } }}
          accessibilityRole="link"
          onPress={Platform.OS === 'web' ? undefined : () => void Linking.openURL('/api/imports/template.csv')}
          style={styles.templateLink}
          testID="import-template"
        >
          Download a template (every column, one example entry) ↓
        </AppText>
        <View style={styles.row}>
          <FilePickButton label={file ? 'Choose another file' : 'Choose a CSV file'} accept=".csv,text/csv" onPick={pick} testID="import-pick" kind={file ? 'quiet' : 'primary'} />
          {file ? (
            <AppText testID="import-file-name" style={styles.fileName}>
              {file.name} · {fileSizeText(file.sizeBytes)}
            </AppText>
          ) : null}
        </View>
        {tooLarge ? (
          <FormError message={`This file is ${fileSizeText(file.sizeBytes)}; the importer takes at most 5 MB. Split it into smaller files.`} testID="import-too-large" />
        ) : null}
        {groups.length > 1 ? (
          <View style={styles.groupPick}>
            <AppText variant="label" tone="muted">Import into</AppText>
            <View style={styles.chips}>
              {groups.map((g) => (
                <Chip key={g.groupId} label={g.groupName} selected={groupId === g.groupId} onPress={() => setGroupId(g.groupId)} testID={`import-group-${g.groupId}`} />
              ))}
            </View>
          </View>
        ) : null}
      </Card>

      {headers.length > 0 ? (
        <Card title="2 · Columns" testID="import-mapping">
          <ColumnMapping headers={headers} choices={choices} onChange={setChoices} />
        </Card>
      ) : null}

      <Card title={headers.length > 0 ? '3 · Check (dry run)' : '2 · Check (dry run)'}>
        <AppText tone="soft">A dry run reads every row and reports problems. Nothing is written to the library.</AppText>
        <View style={styles.row}>
          <Button
            label={dry && !dryClean && checkedMapping !== mappingKey ? 'Check again with these columns' : 'Check the file'}
            onPress={() => send(true)}
            disabled={!file || tooLarge || start.isPending || dryRunning || (groups.length > 1 && !groupId)}
            testID="import-dry-run"
          />
          {groups.length > 1 && !groupId ? <AppText variant="caption" tone="muted">Choose a group first.</AppText> : null}
        </View>
        {refusal ? (
          <View testID="import-error">
            <FormError message={importRefusalText(refusal)} />
            {refusal instanceof FileRefusedError && refusal.issues.length > 0 ? <IssueTable issues={refusal.issues} total={refusal.issues.length} /> : null}
          </View>
        ) : null}
        {dryRunning ? <JobProgress job={dry} label="Checking rows…" /> : null}
        {dryJob.isError && !dry ? <FormError message={importRefusalText(dryJob.error)} testID="import-poll-error" /> : null}
        {dry && isImportFinished(dry) ? <DryRunReport job={dry} stale={checkedMapping !== mappingKey} /> : null}
        {dry && isImportFinished(dry) && dry.duplicates.length > 0 ? (
          <DuplicateChoices
            job={dry}
            forAll={duplicatesChoice}
            perRow={rowChoices}
            onForAll={(choice) => {
              setDuplicatesChoice(choice);
              setRowChoices({});
            }}
            onRow={(row, choice) => setRowChoices((current) => ({ ...current, [String(row)]: choice }))}
          />
        ) : null}
      </Card>

      <Card title={headers.length > 0 ? '4 · Import' : '3 · Import'}>
        {dryClean && dry ? (
          <>
            <AppText tone="soft">
              The entries are created in your group with the status “submitted”: curators review them before they become the group’s data.
            </AppText>
            <View style={styles.row}>
              <Button
                label={`Import ${dry.entryCount} ${dry.entryCount === 1 ? 'entry' : 'entries'} (submitted for review)`}
                onPress={() => send(false)}
                disabled={start.isPending}
                testID="import-run"
              />
            </View>
          </>
        ) : (
          <AppText tone="muted" testID="import-run-waiting">
            {dry && checkedMapping !== mappingKey
              ? 'The columns changed since the last check: check the file again before importing.'
              : 'Importing opens once a dry run finds no problems.'}
          </AppText>
        )}
        {start.isPending ? <ActivityIndicator color={colors.accent} /> : null}
      </Card>
    </Screen>
  );
}

function ImportHeading() {
  return (
    <View style={styles.section}>
      <TextLink href="/library" testID="import-back">← Library</TextLink>
      <AppText variant="display" accessibilityRole="header">Import from CSV</AppText>
    </View>
  );
}

function JobProgress({ job, label }: { job: ImportJob | undefined; label: string }) {
  const processed = job?.processed ?? 0;
  const total = job?.total ?? 0;
  const fraction = total > 0 ? Math.min(1, processed / total) : 0;
  return (
    <View style={styles.progress} testID="import-progress" accessibilityRole="progressbar" accessibilityValue={{ min: 0, max: total, now: processed }}>
      <AppText variant="caption" tone="muted">
        {label} {total > 0 ? `${processed} of ${total} rows` : ''}
      </AppText>
      <View style={styles.track}>
        <View style={StyleSheet.flatten([styles.bar, { width: `${Math.round(fraction * 100)}%` }])} />
      </View>
    </View>
  );
}

/** Entries named from their formula, listed one by one up to this many. */
const NAMED_SHOWN = 10;

function DryRunReport({ job, stale }: { job: ImportJob; stale: boolean }) {
  const clean = job.state === 'succeeded' && job.errorCount === 0;
  return (
    <View style={styles.report} testID="import-report">
      {stale ? <AppText variant="caption" style={styles.staleNote}>The columns changed after this check; check again to see the effect.</AppText> : null}
      {clean ? (
        <FormError
          tone="done"
          message={`All ${job.total} rows are valid: ${job.entryCount} ${job.entryCount === 1 ? 'entry' : 'entries'} with ${job.measurementCount} ${job.measurementCount === 1 ? 'measurement' : 'measurements'}. Nothing was written yet.`}
          testID="import-report-clean"
        />
      ) : null}
      {clean && job.suggestedNames.length > 0 ? (
        <View style={styles.section} testID="import-report-named">
          <AppText tone="soft">
            {job.suggestedNames.length === 1 ? 'One entry has' : `${job.suggestedNames.length} entries have`} no name in the file and will take the name
            suggested from the formula (you can change it on the entry later):
          </AppText>
          {job.suggestedNames.slice(0, NAMED_SHOWN).map((n) => (
            <AppText key={n.row} testID={`import-report-named-${n.row}`}>
              Row {n.row}: {n.name}
            </AppText>
          ))}
          {job.suggestedNames.length > NAMED_SHOWN ? (
            <AppText variant="caption" tone="muted">The first {NAMED_SHOWN} are listed.</AppText>
          ) : null}
        </View>
      ) : null}
      {clean ? null : (
        <>
          <AppText tone="danger" testID="import-report-summary">
            {job.errorCount > 0
              ? `${job.errorCount} ${job.errorCount === 1 ? 'problem' : 'problems'} in ${job.total} rows. Nothing was written; correct the file (or the columns above) and check again.`
              : (job.message ?? 'The check stopped. Nothing was written.')}
          </AppText>
          {job.errors.length > 0 ? <IssueTable issues={job.errors} total={job.errorCount} /> : null}
        </>
      )}
    </View>
  );
}

const CHOICE_LABELS: Record<DuplicateChoice, string> = { skip: 'Skip', merge: 'Add its measurements', import: 'Import anyway' };

/**
 * Entries of the file whose species (metal, oxidation state, ligand set) is already in the library
 * or earlier in the file: one choice for all, and per row.
 */
function DuplicateChoices({ job, forAll, perRow, onForAll, onRow }: {
  job: ImportJob;
  forAll: DuplicateChoice;
  perRow: Record<string, DuplicateChoice>;
  onForAll: (choice: DuplicateChoice) => void;
  onRow: (row: number, choice: DuplicateChoice) => void;
}) {
  return (
    <View style={styles.report} testID="import-duplicates">
      <AppText variant="lead">
        {job.duplicates.length === 1 ? 'One entry repeats a species' : `${job.duplicates.length} entries repeat a species`}
      </AppText>
      <AppText tone="soft">
        Same metal centre, oxidation state and ligand set as an entry already in the library or earlier in this file. Choose what the import does with
        them; adding the measurements to an existing entry sends it for review again.
      </AppText>
      <View style={styles.choiceRow} accessibilityRole="radiogroup" accessibilityLabel="For every repeated entry">
        <AppText variant="label">For all:</AppText>
        {duplicateChoices.map((choice) => (
          <Chip key={choice} label={CHOICE_LABELS[choice]} selected={forAll === choice && Object.keys(perRow).length === 0} onPress={() => onForAll(choice)} testID={`import-duplicates-all-${choice}`} />
        ))}
      </View>
      {job.duplicates.map((d) => {
        const chosen = perRow[String(d.row)] ?? forAll;
        return (
          <View key={d.row} style={styles.duplicate} testID={`import-duplicate-${d.row}`}>
            <AppText>
              Row {d.row}: <AppText style={styles.mono}>{d.formula}</AppText> “{d.name}”{' '}
              {d.existing ? `is already in the library as “${d.existing.name}” (${d.existing.status}).` : `is the same species as row ${d.sameAsRow}.`}
            </AppText>
            <View style={styles.choiceRow} accessibilityRole="radiogroup" accessibilityLabel={`Row ${d.row}`}>
              {duplicateChoices.map((choice) => (
                <Chip key={choice} label={CHOICE_LABELS[choice]} selected={chosen === choice} onPress={() => onRow(d.row, choice)} testID={`import-duplicate-${d.row}-${choice}`} />
              ))}
            </View>
          </View>
        );
      })}
    </View>
  );
}

/** Row-by-row problems; rows are numbered as a spreadsheet shows them (the header is row 1). */
/** Row numbers as people read them: [2, 3, 4, 7] → "2–4, 7". */
export function rowRanges(rows: readonly number[]): string {
  const sorted = [...new Set(rows)].sort((x, y) => x - y);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j]! + 1) j += 1;
    parts.push(j > i ? `${sorted[i]}–${sorted[j]}` : String(sorted[i]));
    i = j + 1;
  }
  return parts.join(', ');
}

/** One line per kind of problem (same column, same message) with the rows it occurs in. */
export function groupIssues(issues: readonly ImportIssue[]): { rows: number[]; column: string | null; message: string; position?: number }[] {
  const groups = new Map<string, { rows: number[]; column: string | null; message: string; position?: number }>();
  for (const issue of issues) {
    // A problem at a character position belongs to its own cell.
    const key = issue.position === undefined ? `${issue.column ?? ''}\u0000${issue.message}` : `${issue.row}\u0000${issue.column ?? ''}\u0000${issue.message}`;
    const group = groups.get(key);
    if (group) group.rows.push(issue.row);
    else groups.set(key, { rows: [issue.row], column: issue.column, message: issue.message, position: issue.position });
  }
  return [...groups.values()];
}

function IssueTable({ issues, total }: { issues: ImportIssue[]; total: number }) {
  return (
    <View style={styles.table}>
      <View style={StyleSheet.flatten([styles.tr, styles.th])}>
        <AppText variant="label" tone="muted" style={styles.colRow}>Rows</AppText>
        <AppText variant="label" tone="muted" style={styles.colColumn}>Column</AppText>
        <AppText variant="label" tone="muted" style={styles.colMessage}>Problem</AppText>
      </View>
      {groupIssues(issues).map((issue, i) => (
        <View key={`${issue.rows[0]}-${issue.column ?? ''}-${i}`} style={styles.tr} testID={`import-report-row-${i}`}>
          <AppText style={styles.colRow}>{rowRanges(issue.rows)}</AppText>
          <AppText style={styles.colColumn}>{issue.column ?? 'whole row'}</AppText>
          <AppText style={styles.colMessage}>
            {issue.message}
            {issue.position !== undefined && !/character \d+/.test(issue.message) ? ` (at character ${issue.position})` : ''}
          </AppText>
        </View>
      ))}
      {total > issues.length ? (
        <AppText variant="caption" tone="muted">The first {issues.length} of {total} problems are listed.</AppText>
      ) : null}
    </View>
  );
}

/** Our column → the words a person reads for it in the mapping. */
const REQUIRED_WORDS: Partial<Record<CsvColumn, string>> = { formula: 'formula', name: 'name' };

function ColumnMapping({ headers, choices, onChange }: {
  headers: string[];
  choices: ColumnChoice;
  onChange: (next: ColumnChoice) => void;
}) {
  const [open, setOpen] = useState<string | null>(null);
  // The same plan the server makes: recognised by name, the person's choices winning.
  const recognised = useMemo(() => planCsvColumns(headers), [headers]);
  const plan: CsvColumnPlan = useMemo(() => planCsvColumns(headers, mappingFromChoices(choices)), [headers, choices]);
  const recognisedAs = (header: string) => recognised.columns.find((c) => c.header === header)?.column ?? null;
  const choose = (header: string, column: CsvColumn | null) => {
    const next: ColumnChoice = {};
    // One header per column: choosing a column for this header frees it elsewhere.
    for (const [h, c] of Object.entries(choices)) if (h !== header && (column === null || c !== column)) next[h] = c;
    if (column !== null || recognisedAs(header) !== null) next[header] = column;
    onChange(next);
    setOpen(null);
  };
  const problems = Object.values(plan.problems).filter((p): p is string => !!p);
  return (
    <View style={styles.mapping}>
      <AppText tone="soft">
        Each header of your file and the Sphereline column it fills, read from the file before anything is sent. Tap a column to
        change it. To leave out a column Sphereline recognises by name, rename its header in the file.
      </AppText>
      {plan.missing.length > 0 ? (
        <FormError
          message={`Missing: ${plan.missing.map((c) => REQUIRED_WORDS[c] ?? c).join(' and ')}. Every entry needs ${plan.missing.length === 1 ? 'this column' : 'these columns'}: choose ${plan.missing.length === 1 ? 'the header that holds it' : 'the headers that hold them'} below, or add ${plan.missing.length === 1 ? 'it' : 'them'} to the file.`}
          testID="import-mapping-missing"
        />
      ) : (
        <AppText variant="caption" tone="muted" testID="import-mapping-complete">The required columns (formula and name) are there.</AppText>
      )}
      {problems.map((problem) => (
        <FormError key={problem} message={problem} testID="import-mapping-problem" />
      ))}
      {headers.map((header, i) => {
        const column = plan.columns[i]?.column ?? null;
        return (
          <View key={header || `h-${i}`} style={styles.mapRow} testID={`import-mapping-${i}`}>
            <View style={styles.mapHead}>
              <AppText style={styles.header} numberOfLines={1}>{header || '(empty header)'}</AppText>
              <AppText tone="muted" accessibilityLabel="fills">→</AppText>
              <Chip
                label={column ?? 'not used'}
                mono={column !== null}
                selected={open === header}
                onPress={() => setOpen(open === header ? null : header)}
                testID={`import-mapping-${i}-current`}
              />
              {header in choices ? <AppText variant="caption" tone="accent">changed</AppText> : null}
            </View>
            {open === header ? (
              <View style={styles.chips}>
                {/* The server's mapping names columns, not skips: a recognised header is read unless renamed. */}
                {recognisedAs(header) ? null : (
                  <Chip label="not used" selected={column === null} onPress={() => choose(header, null)} testID={`import-mapping-${i}-none`} />
                )}
                {csvColumns.map((c) => (
                  <Chip key={c} label={c} mono selected={column === c} onPress={() => choose(header, c)} testID={`import-mapping-${i}-${c}`} />
                ))}
              </View>
            ) : null}
          </View>
        );
      })}
    </View>
  );
}

/** At most this many created entries are listed one by one; the rest are in the library. */
const CREATED_SHOWN = 50;

function RunStatus({ job, canReview, onAnother, onFresh }: { job: ImportJob; canReview: boolean; onAnother: () => void; onFresh: () => void }) {
  if (!isImportFinished(job)) {
    return (
      <Card title="Importing">
        <JobProgress job={job} label={job.state === 'importing' ? 'Writing entries…' : 'Reading rows…'} />
        <AppText variant="caption" tone="muted">
          You can leave this page; the import carries on and its entries appear in the library, submitted for review.
        </AppText>
      </Card>
    );
  }
  if (job.state === 'failed') {
    return (
      <Card title="Import stopped">
        <View testID="import-error">
          <FormError message={`${job.message ?? 'The import failed.'}`} />
        </View>
        {job.errors.length > 0 ? <IssueTable issues={job.errors} total={job.errorCount} /> : null}
        <View style={styles.row}>
          <Button label="Start again with this file" kind="quiet" onPress={onAnother} testID="import-restart" />
        </View>
      </Card>
    );
  }
  const merged = job.duplicates.filter((d) => d.choice === 'merge');
  const skipped = job.duplicates.filter((d) => d.choice === 'skip');
  const createdByRow = new Map(job.created.map((c) => [c.row, c]));
  return (
    <Card title="Imported">
      <View testID="import-done" style={styles.section}>
        <FormError
          tone="done"
          message={`${job.entryCount} ${job.entryCount === 1 ? 'entry' : 'entries'} with ${job.measurementCount} ${job.measurementCount === 1 ? 'measurement' : 'measurements'} were added and submitted for review.`}
        />
        {job.created.length > 0 ? (
          <View style={styles.section}>
            <AppText variant="lead" accessibilityRole="header">Created</AppText>
            <View role="list" testID="import-created">
              {job.created.slice(0, CREATED_SHOWN).map((entry, i) => (
                <View key={entry.id} role="listitem" style={styles.createdRow} testID={`import-created-${i}`}>
                  <View style={styles.createdFormula}>
                    <FormulaText formula={entry.formula} />
                  </View>
                  <View style={styles.createdName}>
                    <TextLink href={`/library/${entry.id}`} testID={`import-created-${i}-link`}>{entry.name}</TextLink>
                  </View>
                  <StatusPill status={entry.status} />
                </View>
              ))}
            </View>
            {job.created.length > CREATED_SHOWN ? (
              <AppText variant="caption" tone="muted" testID="import-created-more">
                The first {CREATED_SHOWN} of {job.created.length} are listed; every one is in the library.
              </AppText>
            ) : null}
          </View>
        ) : null}
        {merged.length > 0 ? (
          <View style={styles.section} testID="import-merged">
            <AppText variant="lead" accessibilityRole="header">Added to existing entries</AppText>
            {merged.map((d) => {
              const target = d.existing ? { id: d.existing.id, name: d.existing.name } : (() => {
                const earlier = d.sameAsRow === null ? undefined : createdByRow.get(d.sameAsRow);
                return earlier ? { id: earlier.id, name: earlier.name } : null;
              })();
              return (
                <View key={d.row} style={styles.createdRow} testID={`import-merged-${d.row}`}>
                  <AppText>Row {d.row}: the measurements of</AppText>
                  <FormulaText formula={d.formula} />
                  <AppText>went to</AppText>
                  {target ? <TextLink href={`/library/${target.id}`}>{target.name}</TextLink> : <AppText>the entry of row {d.sameAsRow}</AppText>}
                </View>
              );
            })}
          </View>
        ) : null}
        {skipped.length > 0 ? (
          <View style={styles.section} testID="import-skipped">
            <AppText variant="lead" accessibilityRole="header">Skipped</AppText>
            {skipped.map((d) => (
              <View key={d.row} style={styles.createdRow} testID={`import-skipped-${d.row}`}>
                <AppText>Row {d.row}:</AppText>
                <FormulaText formula={d.formula} />
                <AppText>{d.existing ? `already in the library as “${d.existing.name}”` : `the same species as row ${d.sameAsRow}`}</AppText>
              </View>
            ))}
          </View>
        ) : null}
        <View style={styles.row}>
          {canReview ? <TextLink href="/review" testID="import-to-review">Open the review queue</TextLink> : null}
          <TextLink href="/library" testID="import-to-library">Open the library</TextLink>
          <Button label="Import another file" kind="quiet" onPress={onFresh} testID="import-another" />
        </View>
        {canReview ? null : (
          <AppText variant="caption" tone="muted" testID="import-review-note">
            Your group’s curators review the new entries; you can open and edit them meanwhile.
          </AppText>
        )}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  templateLink: { color: colors.accent, textDecorationLine: 'underline', minHeight: 44, paddingVertical: spacing.sm },
  choiceRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.xs },
  duplicate: { gap: spacing.xs, paddingVertical: spacing.xs, borderTopWidth: 1, borderTopColor: colors.line },
  mono: { fontFamily: fonts.mono },
  section: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.md },
  fileName: { fontFamily: fonts.mono },
  groupPick: { gap: spacing.xs },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  progress: { gap: spacing.xs },
  track: { height: 8, borderRadius: radius.pill, backgroundColor: colors.accentSoft, overflow: 'hidden' },
  bar: { height: 8, borderRadius: radius.pill, backgroundColor: colors.accent },
  report: { gap: spacing.sm },
  staleNote: { color: colors.amber },
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
  tr: { flexDirection: 'row', gap: spacing.md, paddingHorizontal: spacing.md, paddingVertical: spacing.sm, borderTopWidth: 1, borderTopColor: colors.line },
  th: { backgroundColor: colors.paper, borderTopWidth: 0 },
  colRow: { width: 48 },
  colColumn: { width: 140 },
  colMessage: { flex: 1 },
  mapping: { gap: spacing.sm },
  mapRow: { gap: spacing.xs, paddingVertical: spacing.xs, borderTopWidth: 1, borderTopColor: colors.line },
  mapHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  header: { fontFamily: fonts.mono, maxWidth: 260 },
  createdRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.xs, borderTopWidth: 1, borderTopColor: colors.line },
  createdFormula: { minWidth: 140 },
  createdName: { flexShrink: 1 },
});
