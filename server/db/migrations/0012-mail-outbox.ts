import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Mail goes through an outbox: a row per message (or per password-reset request, which the worker
// turns into a message), retried with backoff until sent or given up, claimed with
// FOR UPDATE SKIP LOCKED so several processes can share it (docs/decisions/026-mail-outbox.md).
// Invitations can be revoked, and one address has at most one live invitation.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE mail_outbox (
      id SERIAL PRIMARY KEY,
      kind TEXT NOT NULL DEFAULT 'message' CHECK (kind IN ('message', 'password-reset')),
      recipients JSONB NOT NULL CHECK (jsonb_typeof(recipients) = 'array' AND jsonb_array_length(recipients) > 0),
      subject TEXT NOT NULL DEFAULT '',
      body TEXT,
      ref TEXT,
      status TEXT NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'sent', 'failed')),
      attempts INTEGER NOT NULL DEFAULT 0,
      next_attempt_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      leased_until TIMESTAMPTZ,
      last_error TEXT,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      sent_at TIMESTAMPTZ
    );
    CREATE INDEX mail_outbox_due_idx ON mail_outbox (next_attempt_at) WHERE status = 'pending';
    CREATE INDEX mail_outbox_ref_idx ON mail_outbox (ref);

    ALTER TABLE invitations ADD COLUMN revoked_at TIMESTAMPTZ;
    ALTER TABLE invitations ADD COLUMN revoked_by_id INTEGER REFERENCES users(id);
    -- A resent invitation gets a new link and expiry; sent_at says when (null: when created).
    ALTER TABLE invitations ADD COLUMN sent_at TIMESTAMPTZ;
    -- Before this, an address could hold several unused invitations: the newest stays.
    UPDATE invitations i SET revoked_at = now()
     WHERE used_at IS NULL AND revoked_at IS NULL
       AND EXISTS (SELECT 1 FROM invitations j WHERE j.email = i.email AND j.used_at IS NULL AND j.id > i.id);
    CREATE UNIQUE INDEX invitations_one_live_per_email ON invitations (email) WHERE used_at IS NULL AND revoked_at IS NULL;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP INDEX IF EXISTS invitations_one_live_per_email;
    ALTER TABLE invitations DROP COLUMN IF EXISTS sent_at;
    ALTER TABLE invitations DROP COLUMN IF EXISTS revoked_by_id;
    ALTER TABLE invitations DROP COLUMN IF EXISTS revoked_at;
    DROP TABLE IF EXISTS mail_outbox;
  `);
};
