import type { Migration } from '../db/migrator';

// The tool registry: tools, their parts and revisions, products and the bill of parts.
// The rules that keep the register trustworthy live here, in the database: unique codes and SKUs,
// foreign keys, non-negative money and counts, at least one cavity, mold class 101-105, and a bill
// line that can only point at a part of its own tool and at a revision that exists.

export const up: Migration = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);

  await q(`
    CREATE TYPE enum_tools_construction AS ENUM ('aluminium', 'pre_hardened_steel', 'hardened_steel', 'stainless');
    CREATE TYPE enum_tools_status AS ENUM ('active', 'idle', 'in_change', 'retained', 'disposed');
    CREATE TYPE enum_tools_retention_decision AS ENUM ('keep_until', 'scrap', 'sell');
    CREATE TYPE enum_products_status AS ENUM ('in_line', 'reissue_planned', 'retired');
  `);

  await q(`
    CREATE TABLE tools (
      id uuid PRIMARY KEY,
      code varchar(32) NOT NULL,
      name varchar(160) NOT NULL,
      brand_id uuid NOT NULL REFERENCES brands(id) ON DELETE RESTRICT,
      factory_id uuid NOT NULL REFERENCES factories(id) ON DELETE RESTRICT,
      construction enum_tools_construction NOT NULL,
      mold_class smallint NOT NULL,
      rated_shots integer NOT NULL,
      rated_shots_source text NOT NULL,
      cavity_count integer NOT NULL,
      weight_kg numeric(9, 2),
      build_cost_cents bigint,
      currency char(3) NOT NULL DEFAULT 'USD',
      build_date date,
      shot_count bigint NOT NULL DEFAULT 0,
      last_run_date date,
      status enum_tools_status NOT NULL DEFAULT 'active',
      storage_location varchar(160),
      current_revision integer NOT NULL DEFAULT 1,
      version integer NOT NULL DEFAULT 0,
      retention_decision enum_tools_retention_decision,
      retention_keep_until date,
      retention_decided_by uuid REFERENCES users(id) ON DELETE RESTRICT,
      retention_decided_at timestamptz,
      retention_note text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT tools_code_unique UNIQUE (code),
      CONSTRAINT tools_code_format CHECK (code ~ '^[A-Z0-9]+(-[A-Z0-9]+)*$' AND length(code) >= 3),
      CONSTRAINT tools_name_not_blank CHECK (btrim(name) <> ''),
      CONSTRAINT tools_mold_class_range CHECK (mold_class BETWEEN 101 AND 105),
      CONSTRAINT tools_rated_shots_positive CHECK (rated_shots >= 1),
      CONSTRAINT tools_rated_shots_source_given CHECK (btrim(rated_shots_source) <> ''),
      CONSTRAINT tools_cavities_at_least_one CHECK (cavity_count >= 1),
      CONSTRAINT tools_weight_positive CHECK (weight_kg IS NULL OR weight_kg > 0),
      CONSTRAINT tools_build_cost_non_negative CHECK (build_cost_cents IS NULL OR build_cost_cents >= 0),
      CONSTRAINT tools_currency_format CHECK (currency ~ '^[A-Z]{3}$'),
      CONSTRAINT tools_shot_count_non_negative CHECK (shot_count >= 0),
      CONSTRAINT tools_last_run_after_build CHECK (last_run_date IS NULL OR build_date IS NULL OR last_run_date >= build_date),
      CONSTRAINT tools_current_revision_positive CHECK (current_revision >= 1),
      CONSTRAINT tools_version_non_negative CHECK (version >= 0),
      CONSTRAINT tools_keep_until_with_keep CHECK (CASE WHEN retention_decision = 'keep_until' THEN retention_keep_until IS NOT NULL
                                                   ELSE retention_keep_until IS NULL END),
      CONSTRAINT tools_decision_has_time CHECK ((retention_decision IS NULL) = (retention_decided_at IS NULL)),
      CONSTRAINT tools_scrapped_is_disposed CHECK (retention_decision IS DISTINCT FROM 'scrap' OR status = 'disposed')
    );
    CREATE INDEX tools_brand_code ON tools (brand_id, code);
    CREATE INDEX tools_factory_code ON tools (factory_id, code);
    CREATE INDEX tools_status_code ON tools (status, code);
    CREATE INDEX tools_last_run_date ON tools (last_run_date);
  `);

  await q(`
    CREATE TABLE parts (
      id uuid PRIMARY KEY,
      tool_id uuid NOT NULL REFERENCES tools(id) ON DELETE RESTRICT,
      name varchar(120) NOT NULL,
      resin varchar(60) NOT NULL,
      cavities_per_shot integer NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT parts_tool_name_unique UNIQUE (tool_id, name),
      CONSTRAINT parts_id_tool_unique UNIQUE (id, tool_id),
      CONSTRAINT parts_name_not_blank CHECK (btrim(name) <> ''),
      CONSTRAINT parts_resin_not_blank CHECK (btrim(resin) <> ''),
      CONSTRAINT parts_cavities_at_least_one CHECK (cavities_per_shot >= 1)
    );
  `);

  await q(`
    CREATE TABLE tool_revisions (
      id uuid PRIMARY KEY,
      tool_id uuid NOT NULL REFERENCES tools(id) ON DELETE RESTRICT,
      number integer NOT NULL,
      made_on date NOT NULL,
      change_request_id uuid,
      note text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT tool_revisions_tool_number_unique UNIQUE (tool_id, number),
      CONSTRAINT tool_revisions_number_positive CHECK (number >= 1)
    );
    CREATE INDEX tool_revisions_change_request ON tool_revisions (change_request_id) WHERE change_request_id IS NOT NULL;
  `);

  await q(`
    CREATE TABLE products (
      id uuid PRIMARY KEY,
      sku varchar(40) NOT NULL,
      name varchar(160) NOT NULL,
      brand_id uuid NOT NULL REFERENCES brands(id) ON DELETE RESTRICT,
      status enum_products_status NOT NULL DEFAULT 'in_line',
      fob_cents bigint,
      wholesale_cents bigint,
      retail_cents bigint,
      currency char(3) NOT NULL DEFAULT 'USD',
      planned_units integer NOT NULL DEFAULT 0,
      version integer NOT NULL DEFAULT 0,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT products_sku_unique UNIQUE (sku),
      CONSTRAINT products_sku_not_blank CHECK (btrim(sku) <> ''),
      CONSTRAINT products_name_not_blank CHECK (btrim(name) <> ''),
      CONSTRAINT products_fob_non_negative CHECK (fob_cents IS NULL OR fob_cents >= 0),
      CONSTRAINT products_wholesale_non_negative CHECK (wholesale_cents IS NULL OR wholesale_cents >= 0),
      CONSTRAINT products_retail_non_negative CHECK (retail_cents IS NULL OR retail_cents >= 0),
      CONSTRAINT products_currency_format CHECK (currency ~ '^[A-Z]{3}$'),
      CONSTRAINT products_planned_units_non_negative CHECK (planned_units >= 0),
      CONSTRAINT products_version_non_negative CHECK (version >= 0)
    );
    CREATE INDEX products_brand_sku ON products (brand_id, sku);
    CREATE INDEX products_status_sku ON products (status, sku);
  `);

  // tool_id is carried on each line so the database itself can check that the part belongs to that
  // tool and that the revision exists on it (composite foreign keys).
  await q(`
    CREATE TABLE bill_of_parts (
      id uuid PRIMARY KEY,
      product_id uuid NOT NULL REFERENCES products(id) ON DELETE RESTRICT,
      part_id uuid NOT NULL,
      tool_id uuid NOT NULL,
      revision integer NOT NULL,
      quantity_per_unit integer NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT bill_of_parts_product_part_unique UNIQUE (product_id, part_id),
      CONSTRAINT bill_of_parts_part_of_tool FOREIGN KEY (part_id, tool_id) REFERENCES parts (id, tool_id) ON DELETE RESTRICT,
      CONSTRAINT bill_of_parts_revision_exists FOREIGN KEY (tool_id, revision) REFERENCES tool_revisions (tool_id, number) ON DELETE RESTRICT,
      CONSTRAINT bill_of_parts_quantity_positive CHECK (quantity_per_unit >= 1)
    );
    CREATE INDEX bill_of_parts_part ON bill_of_parts (part_id);
    CREATE INDEX bill_of_parts_tool_revision ON bill_of_parts (tool_id, revision);
  `);

  // Substring search (ILIKE '%text%') on codes and names. Trigram indexes make it fast on large
  // registers; pg_trgm is a "trusted" extension the database owner may create. Where it is not
  // installed the search still works, on a scan.
  const [rows] = (await qi.sequelize.query(`SELECT 1 FROM pg_available_extensions WHERE name = 'pg_trgm'`)) as [unknown[], unknown];
  if (rows.length > 0) {
    try {
      await q(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
      await q(`
        CREATE INDEX tools_code_trgm ON tools USING gin (code gin_trgm_ops);
        CREATE INDEX tools_name_trgm ON tools USING gin (name gin_trgm_ops);
        CREATE INDEX parts_name_trgm ON parts USING gin (name gin_trgm_ops);
        CREATE INDEX products_sku_trgm ON products USING gin (sku gin_trgm_ops);
        CREATE INDEX products_name_trgm ON products USING gin (name gin_trgm_ops);
      `);
    } catch {
      // No right to create the extension here: plain indexes only.
    }
  }

  await q(`
    INSERT INTO company_settings (key, value, created_at, updated_at)
    VALUES ('retention_years', '3'::jsonb, now(), now())
    ON CONFLICT (key) DO NOTHING;
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS bill_of_parts;
    DROP TABLE IF EXISTS products;
    DROP TABLE IF EXISTS tool_revisions;
    DROP TABLE IF EXISTS parts;
    DROP TABLE IF EXISTS tools;
    DROP TYPE IF EXISTS enum_products_status;
    DROP TYPE IF EXISTS enum_tools_retention_decision;
    DROP TYPE IF EXISTS enum_tools_status;
    DROP TYPE IF EXISTS enum_tools_construction;
    DELETE FROM company_settings WHERE key = 'retention_years';
  `);
};
