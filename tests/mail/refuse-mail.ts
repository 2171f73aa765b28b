import { testDatabase } from "../support/database";

/*
 * A real failure inside the database, not a mocked function: a trigger that refuses to queue
 * mail to one address, so the statement fails and aborts whatever transaction it runs in,
 * exactly as a broken queue would.
 */
const quoted = (value: string) => `'${value.replace(/'/g, "''")}'`;

export async function refuseMailTo(address: string): Promise<void> {
  await testDatabase().query(`
    CREATE OR REPLACE FUNCTION test_refuse_mail() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF NEW.to_address = ${quoted(address)} THEN RAISE EXCEPTION 'mail queue refused the row (test)'; END IF;
      RETURN NEW;
    END $$;
    DROP TRIGGER IF EXISTS test_refuse_mail ON mail_messages;
    CREATE TRIGGER test_refuse_mail BEFORE INSERT ON mail_messages FOR EACH ROW EXECUTE FUNCTION test_refuse_mail();
  `);
}

export async function acceptMailAgain(): Promise<void> {
  await testDatabase().query(`DROP TRIGGER IF EXISTS test_refuse_mail ON mail_messages; DROP FUNCTION IF EXISTS test_refuse_mail();`);
}
