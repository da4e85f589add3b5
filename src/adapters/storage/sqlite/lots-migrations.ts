/**
 * Schema of the lot records in SQLite, as migrations for `openDatabase` (./db.ts); the PostgreSQL schema is ../postgres/schema.ts.
 * Readings, product assignments, flags, clearances and the event log are append-only: triggers
 * refuse UPDATE and DELETE, so no code path can overwrite a recorded value. Only the digest
 * claim rows change state (claimed → posted | failed).
 */
import type { Migration } from './db.js';

const appendOnly = (table: string): string => `
CREATE TRIGGER ${table}_no_update BEFORE UPDATE ON ${table}
BEGIN SELECT RAISE(ABORT, '${table} is append-only: record a correction instead'); END;
CREATE TRIGGER ${table}_no_delete BEFORE DELETE ON ${table}
BEGIN SELECT RAISE(ABORT, '${table} is append-only: nothing is deleted'); END;`;

export const LOT_MIGRATIONS: readonly Migration[] = [
  {
    id: 'lots-001-create',
    sql: `
CREATE TABLE lots (
  lot_id        TEXT PRIMARY KEY,
  first_seen_at TEXT NOT NULL
);

CREATE TABLE lot_products (
  id         INTEGER PRIMARY KEY AUTOINCREMENT,
  lot_id     TEXT NOT NULL REFERENCES lots(lot_id),
  product_id TEXT NOT NULL,
  set_at     TEXT NOT NULL,
  set_by     TEXT NOT NULL,
  event_id   TEXT NOT NULL
);
CREATE INDEX lot_products_by_lot ON lot_products(lot_id, id);

CREATE TABLE lot_readings (
  id                     INTEGER PRIMARY KEY AUTOINCREMENT,
  lot_id                 TEXT NOT NULL REFERENCES lots(lot_id),
  wafer                  INTEGER CHECK (wafer IS NULL OR wafer BETWEEN 1 AND 50),
  site                   INTEGER CHECK (site IS NULL OR site BETWEEN 1 AND 999),
  quantity               TEXT NOT NULL CHECK (quantity IN ('resistivity', 'sheet', 'type')),
  as_entered             TEXT NOT NULL,
  value                  REAL NOT NULL,
  unit                   TEXT NOT NULL,
  thickness_cm           REAL,
  spacing_cm             REAL,
  type_method            TEXT,
  resistivity_ohm_cm     REAL CHECK (resistivity_ohm_cm IS NULL OR resistivity_ohm_cm > 0),
  dopant_density_per_cm3 REAL,
  carrier_type           TEXT CHECK (carrier_type IS NULL OR carrier_type IN ('n', 'p', 'indeterminate')),
  temperature_k          REAL,
  verdict                TEXT NOT NULL CHECK (verdict IN ('pass', 'flagged', 'no_verdict')),
  evaluation_json        TEXT NOT NULL,
  supersedes             INTEGER REFERENCES lot_readings(id),
  user_id                TEXT NOT NULL,
  user_name              TEXT,
  surface                TEXT NOT NULL,
  channel_id             TEXT NOT NULL,
  event_id               TEXT NOT NULL,
  event_seq              INTEGER NOT NULL,
  recorded_at            TEXT NOT NULL,
  note                   TEXT,
  UNIQUE (event_id, event_seq)
);
CREATE INDEX lot_readings_by_lot ON lot_readings(lot_id, id);
-- A reading is corrected at most once; corrections form a chain.
CREATE UNIQUE INDEX lot_readings_supersedes ON lot_readings(supersedes) WHERE supersedes IS NOT NULL;

CREATE TABLE lot_flags (
  id                INTEGER PRIMARY KEY AUTOINCREMENT,
  lot_id            TEXT NOT NULL REFERENCES lots(lot_id),
  code              TEXT NOT NULL,
  scope             TEXT NOT NULL,
  wafer             INTEGER,
  site              INTEGER,
  detail_json       TEXT NOT NULL,
  product_id        TEXT,
  raised_at         TEXT NOT NULL,
  raised_by_reading INTEGER REFERENCES lot_readings(id),
  raised_by_user    TEXT NOT NULL,
  raised_by_name    TEXT,
  event_id          TEXT NOT NULL
);
CREATE INDEX lot_flags_by_lot ON lot_flags(lot_id, id);
CREATE INDEX lot_flags_by_time ON lot_flags(raised_at);
CREATE INDEX lot_flags_by_reading ON lot_flags(raised_by_reading);

CREATE TABLE lot_flag_clearances (
  flag_id      INTEGER PRIMARY KEY REFERENCES lot_flags(id),
  kind         TEXT NOT NULL CHECK (kind IN ('person', 'correction')),
  at           TEXT NOT NULL,
  by_user      TEXT NOT NULL,
  by_name      TEXT,
  reason       TEXT NOT NULL,
  corrected_by INTEGER REFERENCES lot_readings(id),
  event_id     TEXT NOT NULL
);

-- One row per chat event that wrote something: the same event again is recognised here.
CREATE TABLE lot_events (
  event_id     TEXT PRIMARY KEY,
  kind         TEXT NOT NULL CHECK (kind IN ('record', 'clear')),
  lot_id       TEXT NOT NULL,
  at           TEXT NOT NULL,
  outcome_json TEXT NOT NULL
);

-- The daily summary: one claim row per channel per local date, inserted before posting.
CREATE TABLE digest_runs (
  channel      TEXT NOT NULL,
  local_date   TEXT NOT NULL,
  slot_at      TEXT NOT NULL,
  claimed_at   TEXT NOT NULL,
  claimed_by   TEXT NOT NULL,
  late         INTEGER NOT NULL CHECK (late IN (0, 1)),
  status       TEXT NOT NULL CHECK (status IN ('claimed', 'posted', 'failed')),
  attempts     INTEGER NOT NULL DEFAULT 1,
  window_start TEXT,
  window_end   TEXT,
  posted_at    TEXT,
  error        TEXT,
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
    // The sites of a wafer map recorded from a measurement file (record <lot> w<n> map): one row
    // per site, beside its reading, append-only like the reading. Site labels are the file's
    // (any text, any number of sites up to the file limit), not the 1–999 of spot readings.
    id: 'lots-002-map-sites',
    sql: `
CREATE TABLE lot_map_sites (
  reading_id         INTEGER NOT NULL REFERENCES lot_readings(id),
  seq                INTEGER NOT NULL CHECK (seq >= 0),
  label              TEXT NOT NULL,
  x_mm               REAL NOT NULL,
  y_mm               REAL NOT NULL,
  value              REAL CHECK (value IS NULL OR value > 0),
  resistivity_ohm_cm REAL CHECK (resistivity_ohm_cm IS NULL OR resistivity_ohm_cm > 0),
  included           INTEGER NOT NULL CHECK (included IN (0, 1)),
  PRIMARY KEY (reading_id, seq)
) WITHOUT ROWID;
${appendOnly('lot_map_sites')}
`,
  },
];
