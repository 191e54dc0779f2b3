/**
 * Report credits: a lab's price list, purchases through the payment provider, receipts, and the
 * credit ledger that every balance is summed from.
 *
 * The ledger is append-only (the refuse_change trigger of 0001): a balance is SUM(credits) over
 * the rows of one (lab, client), never a counter that could drift. Provider event ids and
 * checkout session ids are UNIQUE, so a webhook delivered many times credits once.
 *
 * Row-level security: each table has the usual tenant policy for the lab that owns it. The
 * manufacturer a lab's client record links to (clients.client_organization_id) gets narrow
 * SELECT policies: the lab's client records that name it, the price lists of those labs, its
 * ledger rows, and the purchases and receipts it paid for. It may INSERT a pending purchase for
 * itself (the checkout) and nothing else; completing a purchase is the webhook's system work.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const ORG = "nullif(current_setting('app.org_id', true), '')::uuid";
const SYSTEM = "current_setting('app.system', true) = 'on'";
const TENANT_POLICY = `USING (organization_id = ${ORG} OR ${SYSTEM}) WITH CHECK (organization_id = ${ORG} OR ${SYSTEM})`;
/** The active organization is the manufacturer linked to the row's client record. */
const LINKED_CLIENT = (table: string) =>
  `EXISTS (SELECT 1 FROM clients c WHERE c.id = ${table}.client_id AND c.organization_id = ${table}.organization_id AND c.client_organization_id = ${ORG})`;

const TABLES = ['credit_price_lists', 'payment_customers', 'credit_purchases', 'credit_receipts', 'credit_ledger'];

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Targets for same-organization foreign keys (another migration may have made them).
    CREATE UNIQUE INDEX IF NOT EXISTS reports_org_id ON reports (organization_id, id);
    CREATE INDEX IF NOT EXISTS clients_client_organization ON clients (client_organization_id, organization_id) WHERE client_organization_id IS NOT NULL;

    CREATE TABLE credit_price_lists (
      organization_id uuid PRIMARY KEY REFERENCES organizations(id),
      currency text NOT NULL CHECK (currency ~ '^[A-Z]{3}$'),
      packs jsonb NOT NULL CHECK (jsonb_typeof(packs) = 'array' AND jsonb_array_length(packs) BETWEEN 1 AND 10),
      refund_on_withdraw_within_days integer CHECK (refund_on_withdraw_within_days BETWEEN 0 AND 365),
      updated_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    -- The provider's customer for a paying organization (one per manufacturer).
    CREATE TABLE payment_customers (
      organization_id uuid PRIMARY KEY REFERENCES organizations(id),
      provider_customer_id text NOT NULL UNIQUE CHECK (length(provider_customer_id) BETWEEN 1 AND 255),
      created_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE credit_purchases (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_id uuid NOT NULL,
      buyer_organization_id uuid NOT NULL REFERENCES organizations(id),
      bought_by uuid REFERENCES users(id),
      pack_id text NOT NULL CHECK (length(pack_id) BETWEEN 1 AND 40),
      credits integer NOT NULL CHECK (credits BETWEEN 1 AND 1000),
      amount_minor integer NOT NULL CHECK (amount_minor BETWEEN 1 AND 99999999),
      currency text NOT NULL CHECK (currency ~ '^[A-Z]{3}$'),
      status text NOT NULL CHECK (status IN ('pending', 'completed', 'expired', 'needs-review')),
      checkout_session_id text UNIQUE CHECK (length(checkout_session_id) <= 255),
      payment_intent_id text CHECK (length(payment_intent_id) <= 255),
      last_payment_error text CHECK (length(last_payment_error) <= 500),
      completed_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, id),
      FOREIGN KEY (organization_id, client_id) REFERENCES clients (organization_id, id),
      CHECK ((status = 'completed') = (completed_at IS NOT NULL))
    );
    CREATE INDEX credit_purchases_org_created ON credit_purchases (organization_id, created_at DESC);
    CREATE INDEX credit_purchases_buyer_created ON credit_purchases (buyer_organization_id, created_at DESC);

    -- A receipt is a record: written once when the purchase completes, never changed.
    CREATE TABLE credit_receipts (
      purchase_id uuid PRIMARY KEY,
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_id uuid NOT NULL,
      receipt_number text NOT NULL,
      sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      pdf bytea NOT NULL,
      issued_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, receipt_number),
      FOREIGN KEY (organization_id, purchase_id) REFERENCES credit_purchases (organization_id, id)
    );
    CREATE TRIGGER credit_receipts_immutable BEFORE UPDATE OR DELETE ON credit_receipts FOR EACH ROW EXECUTE FUNCTION refuse_change();

    CREATE TABLE credit_ledger (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_id uuid NOT NULL,
      kind text NOT NULL CHECK (kind IN ('purchase', 'consumption', 'refund', 'adjustment')),
      credits integer NOT NULL CHECK (credits <> 0 AND credits BETWEEN -10000 AND 10000),
      reason text CHECK (length(reason) BETWEEN 1 AND 500),
      created_by uuid REFERENCES users(id),
      purchase_id uuid,
      report_id uuid,
      provider_event_id text UNIQUE CHECK (length(provider_event_id) <= 255),
      created_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (organization_id, client_id) REFERENCES clients (organization_id, id),
      FOREIGN KEY (organization_id, purchase_id) REFERENCES credit_purchases (organization_id, id),
      -- Deferred: the credit is taken before the report row is written, in the same transaction.
      FOREIGN KEY (organization_id, report_id) REFERENCES reports (organization_id, id) DEFERRABLE INITIALLY DEFERRED,
      CHECK (kind <> 'purchase' OR (credits > 0 AND purchase_id IS NOT NULL AND provider_event_id IS NOT NULL)),
      CHECK (kind <> 'consumption' OR (credits = -1 AND report_id IS NOT NULL)),
      CHECK (kind <> 'refund' OR (credits = 1 AND report_id IS NOT NULL AND reason IS NOT NULL)),
      CHECK (kind <> 'adjustment' OR (reason IS NOT NULL AND created_by IS NOT NULL))
    );
    CREATE INDEX credit_ledger_org_client_created ON credit_ledger (organization_id, client_id, created_at);
    CREATE UNIQUE INDEX credit_ledger_one_purchase ON credit_ledger (purchase_id) WHERE kind = 'purchase';
    CREATE UNIQUE INDEX credit_ledger_one_consumption ON credit_ledger (report_id) WHERE kind = 'consumption';
    CREATE UNIQUE INDEX credit_ledger_one_refund ON credit_ledger (report_id) WHERE kind = 'refund';
    CREATE TRIGGER credit_ledger_append_only BEFORE UPDATE OR DELETE ON credit_ledger FOR EACH ROW EXECUTE FUNCTION refuse_change();
  `);
  for (const table of TABLES) {
    await qi.sequelize.query(`
      ALTER TABLE ${table} ENABLE ROW LEVEL SECURITY;
      ALTER TABLE ${table} FORCE ROW LEVEL SECURITY;
      CREATE POLICY tenant_isolation ON ${table} ${TENANT_POLICY};
    `);
  }
  await qi.sequelize.query(`
    -- A manufacturer reads the labs' client records that name it (its own details as the lab keeps
    -- them). Only a manufacturer: a lab named as another lab's client gains nothing from this.
    CREATE POLICY clients_linked_manufacturer_read ON clients FOR SELECT
      USING (client_organization_id = ${ORG} AND EXISTS (SELECT 1 FROM organizations o WHERE o.id = ${ORG} AND o.kind = 'manufacturer'));
    CREATE POLICY credit_price_lists_client_read ON credit_price_lists FOR SELECT
      USING (EXISTS (SELECT 1 FROM clients c WHERE c.organization_id = credit_price_lists.organization_id AND c.client_organization_id = ${ORG}));
    CREATE POLICY credit_ledger_client_read ON credit_ledger FOR SELECT USING (${LINKED_CLIENT('credit_ledger')});
    CREATE POLICY credit_purchases_buyer_read ON credit_purchases FOR SELECT USING (buyer_organization_id = ${ORG});
    CREATE POLICY credit_purchases_buyer_insert ON credit_purchases FOR INSERT
      WITH CHECK (buyer_organization_id = ${ORG} AND status = 'pending' AND completed_at IS NULL AND ${LINKED_CLIENT('credit_purchases')});
    CREATE POLICY credit_receipts_buyer_read ON credit_receipts FOR SELECT
      USING (EXISTS (SELECT 1 FROM credit_purchases p WHERE p.id = credit_receipts.purchase_id AND p.buyer_organization_id = ${ORG}));
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP POLICY IF EXISTS clients_linked_manufacturer_read ON clients;
    DROP TABLE IF EXISTS credit_ledger, credit_receipts, credit_purchases, payment_customers, credit_price_lists;
    DROP INDEX IF EXISTS clients_client_organization;
    -- Drop the index only when it is ours (a plain index), not another migration's constraint.
    DO $$ BEGIN
      IF NOT EXISTS (SELECT 1 FROM pg_constraint WHERE conname = 'reports_org_id') THEN
        DROP INDEX IF EXISTS reports_org_id;
      END IF;
    END $$;
  `);
};

export const migration = { name: '0004-billing', up, down };
