import { Migration } from '@mikro-orm/migrations';

/**
 * The curated complex library: citations (de-duplicated by DOI within a group), the
 * group's own ligand additions, complexes with the engine's derived fields stored for search,
 * measurements, revisions (full JSON snapshots) and reviews.
 *
 * Search: `search_text` (formula tokens, name, metal symbol and element name, ligand names) under a
 * pg_trgm GIN index (the extension comes from the foundation migration); the filters have b-tree
 * or GIN indexes of their own, each led by group_id because every query is scoped to groups.
 */
export class Migration20261215000000_library extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "citation" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade,
      "doi" varchar(200) null,
      "authors" varchar(1000) not null,
      "title" varchar(500) null,
      "journal" varchar(200) not null,
      "year" int null,
      "volume" varchar(40) null,
      "pages" varchar(40) null,
      "created_by_id" uuid null references "app_user" ("id") on delete set null,
      "created_at" timestamptz not null
    );`);
    this.addSql('create unique index "citation_group_doi_unique" on "citation" ("group_id", lower("doi")) where "doi" is not null;');

    this.addSql(`create table "library_ligand" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade,
      "abbreviation" varchar(40) not null,
      "name" varchar(120) not null,
      "charge" int not null,
      "denticity" int not null,
      "donor_atoms" jsonb not null,
      "source" varchar(500) not null,
      "created_by_id" uuid null references "app_user" ("id") on delete set null,
      "created_at" timestamptz not null
    );`);
    this.addSql('create unique index "library_ligand_group_abbreviation_unique" on "library_ligand" ("group_id", lower("abbreviation"));');

    this.addSql(`create table "complex" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade,
      "formula" varchar(300) not null,
      "name" varchar(200) not null,
      "status" varchar(20) not null check ("status" in ('draft', 'submitted', 'approved', 'changes-requested', 'rejected', 'retired')),
      "notes" text null,
      "metal" varchar(3) not null,
      "oxidation_state" int not null,
      "d_electrons" int not null,
      "spin_state" varchar(4) null check ("spin_state" in ('high', 'low')),
      "verdict" varchar(12) not null check ("verdict" in ('labile', 'intermediate', 'inert')),
      "ligand_ids" text[] not null default '{}',
      "ligand_set_key" varchar(400) not null,
      "search_text" text not null,
      "measurement_kinds" text[] not null default '{}',
      "has_citation" boolean not null default false,
      "version" int not null default 1,
      "created_by_id" uuid null references "app_user" ("id") on delete set null,
      "submitted_by_id" uuid null references "app_user" ("id") on delete set null,
      "submitted_at" timestamptz null,
      "approved_snapshot" jsonb null,
      "approved_version" int null,
      "approved_at" timestamptz null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null
    );`);
    this.addSql('create index "complex_search_text_trgm" on "complex" using gin ("search_text" gin_trgm_ops);');
    this.addSql('create index "complex_group_metal_ox_index" on "complex" ("group_id", "metal", "oxidation_state");');
    this.addSql('create index "complex_group_d_index" on "complex" ("group_id", "d_electrons");');
    this.addSql('create index "complex_group_verdict_index" on "complex" ("group_id", "verdict");');
    this.addSql('create index "complex_group_status_index" on "complex" ("group_id", "status", "submitted_at");');
    this.addSql('create index "complex_group_name_index" on "complex" ("group_id", lower("name"), "id");');
    this.addSql('create index "complex_ligand_ids_gin" on "complex" using gin ("ligand_ids");');
    this.addSql('create index "complex_measurement_kinds_gin" on "complex" using gin ("measurement_kinds");');
    this.addSql('create index "complex_measured_match_index" on "complex" ("group_id", "metal", "oxidation_state", "ligand_set_key");');

    this.addSql(`create table "measurement" (
      "id" uuid not null primary key,
      "complex_id" uuid not null references "complex" ("id") on delete cascade,
      "kind" varchar(30) not null,
      "value" double precision not null,
      "unit" varchar(20) not null,
      "temperature_k" double precision null,
      "ionic_strength_m" double precision null,
      "medium" varchar(200) null,
      "method" varchar(200) null,
      "partner_formula" varchar(300) null,
      "citation_id" uuid null references "citation" ("id") on delete set null,
      "notes" text null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null
    );`);
    this.addSql('create index "measurement_complex_id_index" on "measurement" ("complex_id");');
    this.addSql('create index "measurement_citation_id_index" on "measurement" ("citation_id");');

    this.addSql(`create table "complex_revision" (
      "id" uuid not null primary key,
      "complex_id" uuid not null references "complex" ("id") on delete cascade,
      "number" int not null,
      "kind" varchar(12) not null,
      "status" varchar(20) not null,
      "message" varchar(500) not null,
      "snapshot" jsonb not null,
      "author_id" uuid null references "app_user" ("id") on delete set null,
      "created_at" timestamptz not null,
      constraint "complex_revision_complex_number_unique" unique ("complex_id", "number")
    );`);

    this.addSql(`create table "complex_review" (
      "id" uuid not null primary key,
      "complex_id" uuid not null references "complex" ("id") on delete cascade,
      "revision_number" int not null,
      "decision" varchar(20) not null check ("decision" in ('approve', 'request-changes', 'reject')),
      "comment" text not null,
      "reviewer_id" uuid null references "app_user" ("id") on delete set null,
      "self_approved" boolean not null default false,
      "created_at" timestamptz not null
    );`);
    this.addSql('create index "complex_review_complex_id_index" on "complex_review" ("complex_id", "created_at");');
  }

  override async down(): Promise<void> {
    for (const table of ['complex_review', 'complex_revision', 'measurement', 'complex', 'library_ligand', 'citation']) {
      this.addSql(`drop table if exists "${table}" cascade;`);
    }
  }
}
