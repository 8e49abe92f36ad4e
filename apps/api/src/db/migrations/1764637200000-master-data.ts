import type { MigrationInterface, QueryRunner } from 'typeorm';

const table = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci';
const stamps = 'version INT NOT NULL DEFAULT 1, created_at DATETIME(3) NOT NULL, updated_at DATETIME(3) NOT NULL';

/**
 * The plant's master data and demand: plant settings (one row, created here with the defaults),
 * products, bill-of-materials lines, routing steps, work centers and their calendar weeks,
 * materials and scheduled receipts, firm orders and forecasts. Child lists owned by a row
 * (BOM, routing, calendar, receipts) go with it; references from elsewhere block a delete.
 */
export class MasterData1764637200000 implements MigrationInterface {
  name = 'MasterData1764637200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE plant_settings (
        id TINYINT NOT NULL,
        plant_name VARCHAR(120) NOT NULL,
        currency CHAR(3) NOT NULL,
        week_start VARCHAR(9) NOT NULL,
        default_shifts_per_day TINYINT NOT NULL,
        default_hours_per_shift DECIMAL(5,2) NOT NULL,
        default_days_per_week TINYINT NOT NULL,
        default_shift_starts VARCHAR(40) NOT NULL,
        max_weekly_hours DECIMAL(6,2) NOT NULL,
        min_daily_rest_hours DECIMAL(5,2) NOT NULL,
        overtime_premium DECIMAL(5,3) NOT NULL,
        ${stamps},
        PRIMARY KEY (id),
        CONSTRAINT ck_plant_settings_single CHECK (id = 1),
        CONSTRAINT ck_plant_settings_week_start CHECK (week_start IN ('monday','tuesday','wednesday','thursday','friday','saturday','sunday'))
      ) ${table}`);
    // Defaults: 1 × 8 h × 5 days (common practice, no source); 48 h/week average and 11 h daily
    // rest (EU Working Time Directive 2003/88/EC Art. 6, Art. 3); overtime premium 1.5 (US FLSA).
    await q.query(`
      INSERT INTO plant_settings (id, plant_name, currency, week_start, default_shifts_per_day,
        default_hours_per_shift, default_days_per_week, default_shift_starts, max_weekly_hours,
        min_daily_rest_hours, overtime_premium, version, created_at, updated_at)
      VALUES (1, 'My plant', 'EUR', 'monday', 1, 8, 5, '07:00', 48, 11, 1.5, 1, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`);

    await q.query(`
      CREATE TABLE product (
        id INT NOT NULL AUTO_INCREMENT,
        code VARCHAR(40) NOT NULL,
        name VARCHAR(120) NOT NULL,
        unit VARCHAR(16) NOT NULL,
        kind VARCHAR(12) NOT NULL,
        price DECIMAL(14,4) NOT NULL,
        holding_cost_rate_pct DECIMAL(7,3) NOT NULL,
        safety_stock DECIMAL(14,4) NOT NULL,
        batch_multiple DECIMAL(14,4) NOT NULL,
        opening_stock DECIMAL(14,4) NOT NULL,
        late_penalty DECIMAL(14,4) NOT NULL,
        family VARCHAR(40) NULL,
        active TINYINT(1) NOT NULL DEFAULT 1,
        ${stamps},
        PRIMARY KEY (id),
        UNIQUE KEY uq_product_code (code),
        KEY ix_product_name (name),
        KEY ix_product_family (family),
        KEY ix_product_kind (kind),
        CONSTRAINT ck_product_kind CHECK (kind IN ('finished','subassembly')),
        CONSTRAINT ck_product_batch CHECK (batch_multiple > 0)
      ) ${table}`);

    await q.query(`
      CREATE TABLE work_center (
        id INT NOT NULL AUTO_INCREMENT,
        code VARCHAR(40) NOT NULL,
        name VARCHAR(120) NOT NULL,
        efficiency DECIMAL(5,3) NOT NULL,
        overtime_cap_hours DECIMAL(12,4) NULL,
        overtime_cost_per_hour DECIMAL(14,4) NOT NULL,
        shifts_per_day TINYINT NOT NULL,
        hours_per_shift DECIMAL(5,2) NOT NULL,
        days_per_week TINYINT NOT NULL,
        shift_starts VARCHAR(40) NOT NULL,
        ${stamps},
        PRIMARY KEY (id),
        UNIQUE KEY uq_work_center_code (code),
        KEY ix_work_center_name (name),
        CONSTRAINT ck_work_center_efficiency CHECK (efficiency > 0)
      ) ${table}`);

    await q.query(`
      CREATE TABLE work_center_week (
        id INT NOT NULL AUTO_INCREMENT,
        work_center_id INT NOT NULL,
        week_start DATE NOT NULL,
        holiday_days TINYINT NOT NULL DEFAULT 0,
        downtime_hours DECIMAL(12,4) NOT NULL DEFAULT 0,
        extra_shifts TINYINT NOT NULL DEFAULT 0,
        note VARCHAR(200) NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_work_center_week (work_center_id, week_start),
        CONSTRAINT fk_work_center_week_wc FOREIGN KEY (work_center_id) REFERENCES work_center (id) ON DELETE CASCADE
      ) ${table}`);

    await q.query(`
      CREATE TABLE material (
        id INT NOT NULL AUTO_INCREMENT,
        code VARCHAR(40) NOT NULL,
        name VARCHAR(120) NOT NULL,
        unit VARCHAR(16) NOT NULL,
        unit_cost DECIMAL(14,4) NOT NULL,
        on_hand DECIMAL(14,4) NOT NULL,
        lead_time_weeks SMALLINT NOT NULL,
        weekly_supply_cap DECIMAL(14,4) NULL,
        lot_rule VARCHAR(24) NOT NULL,
        lot_size DECIMAL(14,4) NULL,
        ${stamps},
        PRIMARY KEY (id),
        UNIQUE KEY uq_material_code (code),
        KEY ix_material_name (name),
        CONSTRAINT ck_material_lot_rule CHECK (lot_rule IN ('lot_for_lot','fixed_order_quantity','minimum_order_quantity','period_order_quantity'))
      ) ${table}`);

    await q.query(`
      CREATE TABLE scheduled_receipt (
        id INT NOT NULL AUTO_INCREMENT,
        material_id INT NOT NULL,
        week_start DATE NOT NULL,
        qty DECIMAL(14,4) NOT NULL,
        reference VARCHAR(60) NULL,
        PRIMARY KEY (id),
        KEY ix_scheduled_receipt_material_week (material_id, week_start),
        CONSTRAINT fk_scheduled_receipt_material FOREIGN KEY (material_id) REFERENCES material (id) ON DELETE CASCADE
      ) ${table}`);

    await q.query(`
      CREATE TABLE bom_line (
        id INT NOT NULL AUTO_INCREMENT,
        parent_product_id INT NOT NULL,
        position INT NOT NULL,
        component_product_id INT NULL,
        material_id INT NULL,
        qty_per DECIMAL(16,6) NOT NULL,
        scrap_pct DECIMAL(6,3) NOT NULL DEFAULT 0,
        PRIMARY KEY (id),
        KEY ix_bom_line_parent (parent_product_id, position),
        KEY ix_bom_line_component (component_product_id),
        KEY ix_bom_line_material (material_id),
        CONSTRAINT fk_bom_line_parent FOREIGN KEY (parent_product_id) REFERENCES product (id) ON DELETE CASCADE,
        CONSTRAINT fk_bom_line_component FOREIGN KEY (component_product_id) REFERENCES product (id) ON DELETE RESTRICT,
        CONSTRAINT fk_bom_line_material FOREIGN KEY (material_id) REFERENCES material (id) ON DELETE RESTRICT,
        CONSTRAINT ck_bom_line_one_component CHECK ((component_product_id IS NULL) <> (material_id IS NULL)),
        CONSTRAINT ck_bom_line_qty CHECK (qty_per > 0 AND scrap_pct >= 0 AND scrap_pct < 100)
      ) ${table}`);

    await q.query(`
      CREATE TABLE routing_step (
        id INT NOT NULL AUTO_INCREMENT,
        product_id INT NOT NULL,
        sequence INT NOT NULL,
        work_center_id INT NOT NULL,
        hours_per_unit DECIMAL(12,6) NOT NULL,
        setup_hours DECIMAL(12,4) NOT NULL DEFAULT 0,
        PRIMARY KEY (id),
        UNIQUE KEY uq_routing_step (product_id, sequence),
        KEY ix_routing_step_wc (work_center_id),
        CONSTRAINT fk_routing_step_product FOREIGN KEY (product_id) REFERENCES product (id) ON DELETE CASCADE,
        CONSTRAINT fk_routing_step_wc FOREIGN KEY (work_center_id) REFERENCES work_center (id) ON DELETE RESTRICT
      ) ${table}`);

    await q.query(`
      CREATE TABLE firm_order (
        id INT NOT NULL AUTO_INCREMENT,
        product_id INT NOT NULL,
        week_start DATE NOT NULL,
        order_ref VARCHAR(60) NOT NULL,
        qty DECIMAL(14,4) NOT NULL,
        ${stamps},
        PRIMARY KEY (id),
        UNIQUE KEY uq_firm_order (product_id, week_start, order_ref),
        KEY ix_firm_order_week (week_start),
        CONSTRAINT fk_firm_order_product FOREIGN KEY (product_id) REFERENCES product (id) ON DELETE RESTRICT,
        CONSTRAINT ck_firm_order_qty CHECK (qty >= 0)
      ) ${table}`);

    await q.query(`
      CREATE TABLE demand_forecast (
        id INT NOT NULL AUTO_INCREMENT,
        product_id INT NOT NULL,
        week_start DATE NOT NULL,
        qty DECIMAL(14,4) NOT NULL,
        ${stamps},
        PRIMARY KEY (id),
        UNIQUE KEY uq_demand_forecast (product_id, week_start),
        KEY ix_demand_forecast_week (week_start),
        CONSTRAINT fk_demand_forecast_product FOREIGN KEY (product_id) REFERENCES product (id) ON DELETE RESTRICT,
        CONSTRAINT ck_demand_forecast_qty CHECK (qty >= 0)
      ) ${table}`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['demand_forecast', 'firm_order', 'routing_step', 'bom_line', 'scheduled_receipt', 'material', 'work_center_week', 'work_center', 'product', 'plant_settings']) {
      await q.query(`DROP TABLE ${t}`);
    }
  }
}
