import type { Knex } from 'knex';

/**
 * Password reset and taking over an unconfirmed account:
 * - `users.session_version`, carried in every access token: raising it ends every sign-in the
 *   account has at once (not only its refresh tokens, also access tokens still running).
 * - `email_tokens.display_name`: a sign-up under an unconfirmed account's address mails a link
 *   to set the password; the name typed at sign-up waits in that link until it is used.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('session_version').notNullable().defaultTo(0);
  });
  await knex.schema.alterTable('email_tokens', (t) => {
    t.string('display_name', 120).nullable();
  });
}
