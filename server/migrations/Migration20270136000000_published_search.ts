import { Migration } from '@mikro-orm/migrations';
import { deriveColumns } from '@/server/modules/library/derive';

/**
 * Search over what each reader may see. Viewers, and contributors for entries they did not create,
 * search and filter the accepted snapshot; authors and curators the working copy. So the searched
 * columns exist twice: the working ones (`name`, `metal`, …, `search_text`) and `published_*`
 * copies taken from `accepted_snapshot`.
 *
 * A trigger fills the `published_*` columns whenever a snapshot is stored (insert, accept, or any
 * other writer), so no writer has to know of them. Everything but the search text is read from the
 * snapshot itself. The search text needs the engine (element and ligand names), so it is taken
 * from the working `search_text` when the snapshot's formula and name are the working ones (the
 * case at acceptance, where the snapshot is the working copy), kept when the snapshot's formula
 * and name did not change, and otherwise (a writer that stores some other snapshot) a plain
 * normalisation of the snapshot's formula, name and metal — never the working copy's text. A writer
 * may also set `published_search_text` itself in the same statement; the trigger keeps it.
 *
 * Indexes: the published twins of complex_search_cover, complex_search_by_id,
 * complex_search_by_name, complex_search_words_gin and the trigram index, partial on
 * `is_published` (the only rows a restricted reader sees through these columns).
 */
const PUBLISHED_COLUMNS: [string, string][] = [
  ['published_name', 'varchar(200)'],
  ['published_metal', 'varchar(3)'],
  ['published_oxidation_state', 'int'],
  ['published_d_electrons', 'int'],
  ['published_verdict', 'varchar(12)'],
  ['published_ligand_ids', 'text[]'],
  ['published_measurement_kinds', 'text[]'],
  ['published_has_citation', 'boolean'],
  ['published_search_text', 'text'],
];

const FILL_FUNCTION = `create or replace function sphereline_complex_published() returns trigger language plpgsql as $$
  declare
    snap jsonb := new.accepted_snapshot;
    explicit_text boolean := case when tg_op = 'INSERT' then new.published_search_text is not null
                                  else new.published_search_text is distinct from old.published_search_text end;
  begin
    if snap is null then
      new.published_name := null; new.published_metal := null; new.published_oxidation_state := null;
      new.published_d_electrons := null; new.published_verdict := null; new.published_ligand_ids := null;
      new.published_measurement_kinds := null; new.published_has_citation := null; new.published_search_text := null;
      return new;
    end if;
    if tg_op = 'UPDATE' and snap is not distinct from old.accepted_snapshot and old.published_name is not null and not explicit_text then
      return new;
    end if;
    new.published_name := snap->>'name';
    new.published_metal := snap->>'metal';
    new.published_oxidation_state := (snap->>'oxidationState')::int;
    new.published_d_electrons := (snap->>'dElectrons')::int;
    new.published_verdict := snap->>'verdict';
    new.published_ligand_ids := coalesce(array(select x from jsonb_array_elements_text(coalesce(snap->'ligandIds', '[]'::jsonb)) x order by x), '{}');
    new.published_measurement_kinds := coalesce(array(
      select distinct m->>'kind' from jsonb_array_elements(coalesce(snap->'measurements', '[]'::jsonb)) m order by 1), '{}');
    new.published_has_citation := exists (
      select 1 from jsonb_array_elements(coalesce(snap->'measurements', '[]'::jsonb)) m where jsonb_typeof(m->'citation') = 'object');
    if explicit_text then
      null;
    elsif snap->>'formula' = new.formula and snap->>'name' = new.name then
      new.published_search_text := new.search_text;
    elsif tg_op = 'UPDATE' and old.published_search_text is not null
          and snap->>'formula' = old.accepted_snapshot->>'formula' and snap->>'name' = old.accepted_snapshot->>'name' then
      new.published_search_text := old.published_search_text;
    else
      new.published_search_text := trim(regexp_replace(lower(concat_ws(' ', snap->>'formula', snap->>'name', snap->>'metal')), '[^a-z0-9]+', ' ', 'g'));
    end if;
    return new;
  end $$;`;

export class Migration20270136000000_published_search extends Migration {
  override async up(): Promise<void> {
    const run = (sql: string, params?: unknown[]) => this.execute(sql, params);
    for (const [column, type] of PUBLISHED_COLUMNS) await run(`alter table "complex" add column "${column}" ${type} null;`);
    await run(FILL_FUNCTION);
    await run(`create trigger "complex_published_fill" before insert or update on "complex"
      for each row execute function sphereline_complex_published();`);
    // Backfill: the trigger fills every row that has a snapshot.
    await run(`update "complex" set "published_name" = null where "accepted_snapshot" is not null;`);
    // Accepted entries whose pending edit renamed them: their search text from the engine, as the write path makes it.
    const renamed = await run(
      `select id, accepted_snapshot->>'formula' as formula, accepted_snapshot->>'name' as name from "complex"
        where accepted_snapshot is not null and (accepted_snapshot->>'formula' <> formula or accepted_snapshot->>'name' <> name)`,
    );
    for (const row of renamed as { id: string; formula: string; name: string }[]) {
      let text: string;
      try {
        text = deriveColumns(row.formula, row.name).searchText;
      } catch {
        continue; // an unreadable formula keeps the trigger's plain normalisation
      }
      await run(`update "complex" set "published_search_text" = ? where id = ?`, [text, row.id]);
    }
    await run(`create index "complex_published_cover" on "complex" ("group_id", "published_metal", "published_verdict", "published_oxidation_state", "published_d_electrons")
      include ("id", "created_by_id", "published_has_citation", "published_ligand_ids", "published_measurement_kinds", "published_name", "published_search_text")
      where "is_published";`);
    await run(`create index "complex_published_by_id" on "complex" ("group_id", "id")
      include ("created_by_id", "published_metal", "published_verdict", "published_oxidation_state", "published_d_electrons", "published_has_citation",
               "published_ligand_ids", "published_measurement_kinds", "published_search_text")
      where "is_published";`);
    await run(`create index "complex_published_by_name" on "complex" ("group_id", lower("published_name"), "id")
      include ("published_name", "created_by_id", "published_metal", "published_verdict", "published_oxidation_state", "published_d_electrons",
               "published_has_citation", "published_ligand_ids", "published_measurement_kinds")
      where "is_published";`);
    await run(`create index "complex_published_words_gin" on "complex" using gin (string_to_array("published_search_text", ' ')) where "is_published";`);
    await run(`create index "complex_published_text_trgm" on "complex" using gin ("published_search_text" gin_trgm_ops) where "is_published";`);
  }

  override async down(): Promise<void> {
    this.addSql('drop trigger if exists "complex_published_fill" on "complex";');
    this.addSql('drop function if exists sphereline_complex_published();');
    for (const name of ['cover', 'by_id', 'by_name', 'words_gin', 'text_trgm']) this.addSql(`drop index if exists "complex_published_${name}";`);
    for (const [column] of PUBLISHED_COLUMNS) this.addSql(`alter table "complex" drop column if exists "${column}";`);
  }
}
