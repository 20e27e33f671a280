import type { Knex } from 'knex';

/**
 * Makes the database refuse audit rows matching `condition` (SQL over `new`, e.g.
 * `new.entity_type = 'study'`), to prove a write and its audit row commit together or not at all.
 * Returns the function that lifts the refusal. Written for SQLite and for PostgreSQL.
 */
export async function refuseAuditWrites(db: Knex, condition: string): Promise<() => Promise<void>> {
  if (String(db.client.config.client) === 'pg') {
    await db.raw(`create function refuse_audit_for_test() returns trigger language plpgsql as $$
      begin if ${condition} then raise exception 'refused for the test'; end if; return new; end $$`);
    await db.raw(`create trigger refuse_audit_for_test before insert on audit_events
      for each row execute function refuse_audit_for_test()`);
    return async () => {
      await db.raw('drop trigger refuse_audit_for_test on audit_events');
      await db.raw('drop function refuse_audit_for_test()');
    };
  }
  await db.raw(`create trigger refuse_audit_for_test before insert on audit_events
    when ${condition} begin select raise(abort, 'refused for the test'); end`);
  return async () => {
    await db.raw('drop trigger refuse_audit_for_test');
  };
}
