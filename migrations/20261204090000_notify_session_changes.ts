import type { Knex } from 'knex';

// Servers keep each session and its user for a moment (server/src/auth/session-cache.ts). Every
// change a request depends on is told to every server process on the channel `cc_session_changes`,
// from triggers, so that it reaches them whoever writes (a server, the seeds, a script, psql) and
// only once the change is committed (PostgreSQL delivers notices at commit):
//   "s:<sid>"   a session changed or ended (sign-out, a new session on sign-in, a password change
//               or a deactivation ending the account's sessions, expired sessions pruned)
//   "u:<id>"    a user's password, role, organisation, name, e-mail or active flag changed, or the user went
//   "o:<id>"    an organisation's name changed (it is part of the signed-in user), or it went
//   "*"         one of the tables was emptied (TRUNCATE)
// A session's expiry moving on (connect-pg-simple's touch) changes nothing a request reads: no notice.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE FUNCTION notify_session_change() RETURNS trigger AS $$
    BEGIN
      IF TG_OP = 'TRUNCATE' THEN
        PERFORM pg_notify('cc_session_changes', '*');
      ELSIF TG_TABLE_NAME = 'sessions' THEN
        PERFORM pg_notify('cc_session_changes', 's:' || OLD.sid);
      ELSIF TG_TABLE_NAME = 'users' THEN
        PERFORM pg_notify('cc_session_changes', 'u:' || OLD.id);
      ELSE
        PERFORM pg_notify('cc_session_changes', 'o:' || OLD.id);
      END IF;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    CREATE TRIGGER sessions_changed AFTER DELETE ON sessions
      FOR EACH ROW EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER sessions_rewritten AFTER UPDATE ON sessions
      FOR EACH ROW WHEN (OLD.sess::text IS DISTINCT FROM NEW.sess::text) EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER sessions_emptied AFTER TRUNCATE ON sessions
      FOR EACH STATEMENT EXECUTE FUNCTION notify_session_change();

    CREATE TRIGGER users_changed AFTER UPDATE ON users
      FOR EACH ROW WHEN (
        OLD.password_hash IS DISTINCT FROM NEW.password_hash OR OLD.role IS DISTINCT FROM NEW.role
        OR OLD.organisation_id IS DISTINCT FROM NEW.organisation_id OR OLD.is_active IS DISTINCT FROM NEW.is_active
        OR OLD.name IS DISTINCT FROM NEW.name OR OLD.email IS DISTINCT FROM NEW.email
      ) EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER users_removed AFTER DELETE ON users
      FOR EACH ROW EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER users_emptied AFTER TRUNCATE ON users
      FOR EACH STATEMENT EXECUTE FUNCTION notify_session_change();

    CREATE TRIGGER organisations_renamed AFTER UPDATE ON organisations
      FOR EACH ROW WHEN (OLD.name IS DISTINCT FROM NEW.name) EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER organisations_removed AFTER DELETE ON organisations
      FOR EACH ROW EXECUTE FUNCTION notify_session_change();
    CREATE TRIGGER organisations_emptied AFTER TRUNCATE ON organisations
      FOR EACH STATEMENT EXECUTE FUNCTION notify_session_change();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    DROP TRIGGER sessions_changed ON sessions;
    DROP TRIGGER sessions_rewritten ON sessions;
    DROP TRIGGER sessions_emptied ON sessions;
    DROP TRIGGER users_changed ON users;
    DROP TRIGGER users_removed ON users;
    DROP TRIGGER users_emptied ON users;
    DROP TRIGGER organisations_renamed ON organisations;
    DROP TRIGGER organisations_removed ON organisations;
    DROP TRIGGER organisations_emptied ON organisations;
    DROP FUNCTION notify_session_change();
  `);
}
