import type { Knex } from 'knex';

/**
 * Stored upload files in pieces of 1 MiB (upload_chunks) instead of one bytea
 * value (uploads.content): the import writes a file and the download reads it
 * one piece at a time, so neither holds a whole file in memory (issue 8).
 * - The pieces reference their upload with a deferrable foreign key, as the
 *   specimens do: the import writes them before the upload row, in one
 *   transaction.
 * - uploads keeps size_bytes and sha256; a constraint trigger checks at commit
 *   that an upload's pieces add up to its size (the old check compared the size
 *   with octet_length(content)).
 * - Existing files are moved into pieces here, in SQL.
 */
const CHUNK_BYTES = 1024 * 1024; // the import's UPLOAD_CHUNK_BYTES (api/src/coupons/import.service.ts)

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    create table upload_chunks (
      upload_id integer not null,
      seq integer not null,
      bytes bytea not null,
      primary key (upload_id, seq),
      constraint upload_chunks_seq_check check (seq >= 0),
      constraint upload_chunks_bytes_check check (octet_length(bytes) between 1 and ${CHUNK_BYTES}),
      constraint upload_chunks_upload_fk foreign key (upload_id) references uploads (id) deferrable initially immediate
    );
    comment on table upload_chunks is 'the file of an upload as received, in pieces of ${CHUNK_BYTES} bytes (the last one shorter), seq from 0 in byte order';

    insert into upload_chunks (upload_id, seq, bytes)
      select u.id, s.seq, substring(u.content from s.seq * ${CHUNK_BYTES} + 1 for ${CHUNK_BYTES})
      from uploads u
      cross join lateral generate_series(0, (octet_length(u.content) - 1) / ${CHUNK_BYTES}) as s(seq);

    alter table uploads drop constraint uploads_size_check;
    alter table uploads drop column content;
    alter table uploads add constraint uploads_size_check check (size_bytes > 0);

    create function uploads_chunks_complete() returns trigger language plpgsql as $$
    declare
      stored bigint;
    begin
      select coalesce(sum(octet_length(bytes)), 0) into stored from upload_chunks where upload_id = new.id;
      if stored <> new.size_bytes then
        raise exception 'upload % has % bytes in upload_chunks but size_bytes %', new.id, stored, new.size_bytes
          using errcode = 'check_violation', constraint = 'uploads_chunks_complete';
      end if;
      return null;
    end $$;
    create constraint trigger uploads_chunks_complete after insert or update of size_bytes on uploads
      deferrable initially deferred for each row execute function uploads_chunks_complete();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger uploads_chunks_complete on uploads;
    drop function uploads_chunks_complete();
    alter table uploads add column content bytea;
    update uploads u set content = coalesce((select string_agg(c.bytes, ''::bytea order by c.seq) from upload_chunks c where c.upload_id = u.id), ''::bytea);
    alter table uploads alter column content set not null;
    comment on column uploads.content is 'the file as received';
    alter table uploads drop constraint uploads_size_check;
    alter table uploads add constraint uploads_size_check check (size_bytes > 0 and size_bytes = octet_length(content));
    drop table upload_chunks;
  `);
}
