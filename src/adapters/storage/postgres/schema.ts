/**
 * The PostgreSQL schema, as migrations applied by src/adapters/storage/postgres/backend.ts under
 * an advisory lock (several instances starting together apply each migration once).
 *
 * Same tables and column names as the SQLite backend (so both share the row mapping in
 * ../shared/lot-rows.ts), with PostgreSQL types. Times are ISO-8601 UTC text, as in SQLite, with
 * the "C" collation so that comparing and ordering them (and lot ids) is byte order whatever the
 * database's locale. Readings, product assignments, flags, clearances and the event log are
 * append-only: a trigger refuses UPDATE and DELETE, so no code path can overwrite a recorded
 * value. Only digest claim rows and the chat state change.
 */
export interface PgMigration {
  readonly id: string;
  readonly sql: string;
}

const appendOnly = (table: string): string => `
CREATE TRIGGER ${table}_append_only BEFORE UPDATE OR DELETE ON ${table}
  FOR EACH ROW EXECUTE FUNCTION shiftprobe_refuse_change();`;

export const PG_MIGRATIONS: readonly PgMigration[] = [
  {
    id: 'results-001-create',
    sql: `CREATE TABLE results (
            id         text PRIMARY KEY,
            command    text NOT NULL,
            created_at text NOT NULL,
            reply      text NOT NULL
          )`,
  },
  {
    id: 'events-001-create',
    sql: `CREATE TABLE chat_events (
            event_key  text PRIMARY KEY,
            state      text NOT NULL CHECK (state IN ('claimed', 'done')),
            claimed_ms bigint NOT NULL,
            done_ms    bigint
          );
          CREATE INDEX chat_events_claimed ON chat_events (claimed_ms)`,
  },
  {
    id: 'conversations-001-create',
    sql: `CREATE TABLE conversation_last_result (
            conversation_key text PRIMARY KEY,
            result_id        text NOT NULL,
            updated_ms       bigint NOT NULL
          );
          CREATE TABLE known_threads (
            channel_id text NOT NULL,
            thread_ts  text NOT NULL,
            title      text NOT NULL,
            last_ms    bigint NOT NULL,
            PRIMARY KEY (channel_id, thread_ts)
          );
          CREATE INDEX known_threads_recent ON known_threads (channel_id, last_ms DESC)`,
  },
  {
    id: 'lots-001-create',
    sql: `
CREATE FUNCTION shiftprobe_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% is append-only: record a correction instead', TG_TABLE_NAME;
END $$;

CREATE TABLE lots (
  lot_id        text COLLATE "C" PRIMARY KEY,
  first_seen_at text COLLATE "C" NOT NULL
);

CREATE TABLE lot_products (
  id         integer GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
  lot_id     text COLLATE "C" NOT NULL REFERENCES lots(lot_id),
  product_id text NOT NULL,
  set_at     text COLLATE "C" NOT NULL,
  set_by     text NOT NULL,
  event_id   text NOT NULL
);
CREATE INDEX lot_products_by_lot ON lot_products(lot_id, id);

CREATE TABLE lot_readings (
  id                     integer GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
  lot_id                 text COLLATE "C" NOT NULL REFERENCES lots(lot_id),
  wafer                  integer CHECK (wafer IS NULL OR wafer BETWEEN 1 AND 50),
  site                   integer CHECK (site IS NULL OR site BETWEEN 1 AND 999),
  quantity               text NOT NULL CHECK (quantity IN ('resistivity', 'sheet', 'type')),
  as_entered             text NOT NULL,
  value                  double precision NOT NULL,
  unit                   text NOT NULL,
  thickness_cm           double precision,
  spacing_cm             double precision,
  type_method            text,
  resistivity_ohm_cm     double precision CHECK (resistivity_ohm_cm IS NULL OR resistivity_ohm_cm > 0),
  dopant_density_per_cm3 double precision,
  carrier_type           text CHECK (carrier_type IS NULL OR carrier_type IN ('n', 'p', 'indeterminate')),
  temperature_k          double precision,
  verdict                text NOT NULL CHECK (verdict IN ('pass', 'flagged', 'no_verdict')),
  evaluation_json        text NOT NULL,
  supersedes             integer REFERENCES lot_readings(id),
  user_id                text NOT NULL,
  user_name              text,
  surface                text NOT NULL,
  channel_id             text NOT NULL,
  event_id               text NOT NULL,
  event_seq              integer NOT NULL,
  recorded_at            text COLLATE "C" NOT NULL,
  note                   text,
  UNIQUE (event_id, event_seq)
);
CREATE INDEX lot_readings_by_lot ON lot_readings(lot_id, id);
-- A reading is corrected at most once; corrections form a chain.
CREATE UNIQUE INDEX lot_readings_supersedes ON lot_readings(supersedes) WHERE supersedes IS NOT NULL;

CREATE TABLE lot_flags (
  id                integer GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
  lot_id            text COLLATE "C" NOT NULL REFERENCES lots(lot_id),
  code              text NOT NULL,
  scope             text NOT NULL,
  wafer             integer,
  site              integer,
  detail_json       text NOT NULL,
  product_id        text,
  raised_at         text COLLATE "C" NOT NULL,
  raised_by_reading integer REFERENCES lot_readings(id),
  raised_by_user    text NOT NULL,
  raised_by_name    text,
  event_id          text NOT NULL
);
CREATE INDEX lot_flags_by_lot ON lot_flags(lot_id, id);
CREATE INDEX lot_flags_by_time ON lot_flags(raised_at);
CREATE INDEX lot_flags_by_reading ON lot_flags(raised_by_reading);

CREATE TABLE lot_flag_clearances (
  flag_id      integer PRIMARY KEY REFERENCES lot_flags(id),
  kind         text NOT NULL CHECK (kind IN ('person', 'correction')),
  at           text COLLATE "C" NOT NULL,
  by_user      text NOT NULL,
  by_name      text,
  reason       text NOT NULL,
  corrected_by integer REFERENCES lot_readings(id),
  event_id     text NOT NULL
);

-- One row per chat event that wrote something: the same event again is recognised here.
CREATE TABLE lot_events (
  event_id     text PRIMARY KEY,
  kind         text NOT NULL CHECK (kind IN ('record', 'clear')),
  lot_id       text COLLATE "C" NOT NULL,
  at           text COLLATE "C" NOT NULL,
  outcome_json text NOT NULL
);

-- The daily summary: one claim row per destination per local date, inserted before posting.
CREATE TABLE digest_runs (
  channel      text NOT NULL,
  local_date   text NOT NULL,
  slot_at      text COLLATE "C" NOT NULL,
  claimed_at   text COLLATE "C" NOT NULL,
  claimed_by   text NOT NULL,
  late         integer NOT NULL CHECK (late IN (0, 1)),
  status       text NOT NULL CHECK (status IN ('claimed', 'posted', 'failed')),
  attempts     integer NOT NULL DEFAULT 1,
  window_start text COLLATE "C",
  window_end   text COLLATE "C",
  posted_at    text COLLATE "C",
  error        text,
  PRIMARY KEY (channel, local_date)
);
${appendOnly('lots')}
${appendOnly('lot_products')}
${appendOnly('lot_readings')}
${appendOnly('lot_flags')}
${appendOnly('lot_flag_clearances')}
${appendOnly('lot_events')}
`,
  },
  {
    // The sites of a wafer map recorded from a measurement file, beside its reading, append-only.
    id: 'lots-002-map-sites',
    sql: `
CREATE TABLE lot_map_sites (
  reading_id         integer NOT NULL REFERENCES lot_readings(id),
  seq                integer NOT NULL CHECK (seq >= 0),
  label              text NOT NULL,
  x_mm               double precision NOT NULL,
  y_mm               double precision NOT NULL,
  value              double precision CHECK (value IS NULL OR value > 0),
  resistivity_ohm_cm double precision CHECK (resistivity_ohm_cm IS NULL OR resistivity_ohm_cm > 0),
  included           boolean NOT NULL,
  PRIMARY KEY (reading_id, seq)
);
${appendOnly('lot_map_sites')}
`,
  },
];
