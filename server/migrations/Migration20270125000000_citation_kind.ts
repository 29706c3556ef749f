import { Migration } from '@mikro-orm/migrations';

/**
 * What kind of work a citation is (journal article, book, chapter in a book, web page), with the
 * fields books and web pages need, so exports write the right BibTeX and RIS entry types. Existing
 * records are journal articles.
 */
export class Migration20270125000000_citation_kind extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table citation
      add column kind varchar(16) not null default 'article' check (kind in ('article', 'book', 'chapter', 'web-page')),
      add column publisher varchar(200) null,
      add column place varchar(120) null,
      add column url varchar(500) null;`);
  }

  override async down(): Promise<void> {
    this.addSql('alter table citation drop column kind, drop column publisher, drop column place, drop column url;');
  }
}
