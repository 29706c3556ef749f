import { Migration } from '@mikro-orm/migrations';

/**
 * The library's review words: states draft, in-review, accepted, returned, declined, retired and
 * decisions accept, return, decline. Existing rows, revisions, reviews and audit events are
 * rewritten in place; the accepted-snapshot columns are renamed to match.
 */
const STATUS_MAP: [string, string][] = [
  ['submitted', 'in-review'],
  ['approved', 'accepted'],
  ['changes-requested', 'returned'],
  ['rejected', 'declined'],
];
const DECISION_MAP: [string, string][] = [
  ['approve', 'accept'],
  ['request-changes', 'return'],
  ['reject', 'decline'],
];

/** A SQL expression mapping old words to new ones; anything else is kept as it is. */
const mapped = (expr: string, map: [string, string][]) =>
  `case ${expr} ${map.map(([from, to]) => `when '${from}' then '${to}'`).join(' ')} else ${expr} end`;

const caseOf = (column: string, map: [string, string][]) => mapped(`"${column}"`, map);

/** Rewrites one text field inside a jsonb column the same way (snapshots, audit details). */
const jsonField = (column: string, field: string, map: [string, string][]) =>
  `jsonb_set("${column}", '{${field}}', to_jsonb(${mapped(`("${column}"->>'${field}')`, map)}))`;

export class Migration20270135000000_review_words extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table "complex" drop constraint if exists "complex_status_check";');
    this.addSql(`update "complex" set "status" = ${caseOf('status', STATUS_MAP)};`);
    this.addSql(
      `alter table "complex" add constraint "complex_status_check" check ("status" in ('draft', 'in-review', 'accepted', 'returned', 'declined', 'retired'));`,
    );
    this.addSql('alter table "complex" rename column "approved_snapshot" to "accepted_snapshot";');
    this.addSql('alter table "complex" rename column "approved_version" to "accepted_version";');
    this.addSql('alter table "complex" rename column "approved_at" to "accepted_at";');
    this.addSql(`update "complex" set "accepted_snapshot" = ${jsonField('accepted_snapshot', 'status', STATUS_MAP)} where "accepted_snapshot"->>'status' is not null;`);

    this.addSql(`update "complex_revision" set "status" = ${caseOf('status', STATUS_MAP)};`);
    this.addSql(`update "complex_revision" set "snapshot" = ${jsonField('snapshot', 'status', STATUS_MAP)} where "snapshot"->>'status' is not null;`);

    this.addSql('alter table "complex_review" drop constraint if exists "complex_review_decision_check";');
    this.addSql(`update "complex_review" set "decision" = ${caseOf('decision', DECISION_MAP)};`);
    this.addSql(`alter table "complex_review" add constraint "complex_review_decision_check" check ("decision" in ('accept', 'return', 'decline'));`);
    this.addSql('alter table "complex_review" rename column "self_approved" to "self_accepted";');

    for (const [from, to] of STATUS_MAP.slice(1)) {
      this.addSql(`update "audit_event" set "action" = 'library.entry.${to}' where "action" = 'library.entry.${from}';`);
    }
    for (const [field, map] of [['to', STATUS_MAP], ['from', STATUS_MAP], ['decision', DECISION_MAP]] as const) {
      this.addSql(
        `update "audit_event" set "details" = ${jsonField('details', field, map)} where "action" like 'library.entry.%' and "details"->>'${field}' is not null;`,
      );
    }

    // The generated column and the covering index follow the renamed column on their own.
  }

  override async down(): Promise<void> {
    const back = (map: [string, string][]) => map.map(([from, to]) => [to, from] as [string, string]);
    this.addSql('alter table "complex" drop constraint if exists "complex_status_check";');
    this.addSql(`update "complex" set "status" = ${caseOf('status', back(STATUS_MAP))};`);
    this.addSql(
      `alter table "complex" add constraint "complex_status_check" check ("status" in ('draft', 'submitted', 'approved', 'changes-requested', 'rejected', 'retired'));`,
    );
    this.addSql('alter table "complex" rename column "accepted_snapshot" to "approved_snapshot";');
    this.addSql('alter table "complex" rename column "accepted_version" to "approved_version";');
    this.addSql('alter table "complex" rename column "accepted_at" to "approved_at";');
    this.addSql(`update "complex_revision" set "status" = ${caseOf('status', back(STATUS_MAP))};`);
    this.addSql('alter table "complex_review" drop constraint if exists "complex_review_decision_check";');
    this.addSql(`update "complex_review" set "decision" = ${caseOf('decision', back(DECISION_MAP))};`);
    this.addSql(`alter table "complex_review" add constraint "complex_review_decision_check" check ("decision" in ('approve', 'request-changes', 'reject'));`);
    this.addSql('alter table "complex_review" rename column "self_accepted" to "self_approved";');
  }
}
