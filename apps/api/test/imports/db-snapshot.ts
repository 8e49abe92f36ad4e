import type { DataSource } from 'typeorm';

/**
 * The plant's master data and demand as plain rows keyed by codes (no ids, versions or times),
 * sorted, so two databases (or one before and after) compare with toEqual.
 */
export async function masterDataSnapshot(ds: DataSource, options: { withVersions?: boolean } = {}): Promise<Record<string, unknown[]>> {
  const v = options.withVersions ? ', version' : '';
  const q = (sql: string) => ds.query(sql) as Promise<unknown[]>;
  return {
    products: await q(
      `SELECT code, name, unit, kind, price, holding_cost_rate_pct, safety_stock, batch_multiple, opening_stock, late_penalty, family, active${v} FROM product ORDER BY code`,
    ),
    workCenters: await q(
      `SELECT code, name, efficiency, overtime_cap_hours, overtime_cost_per_hour, shifts_per_day, hours_per_shift, days_per_week, shift_starts${v} FROM work_center ORDER BY code`,
    ),
    materials: await q(`SELECT code, name, unit, unit_cost, on_hand, lead_time_weeks, weekly_supply_cap, lot_rule, lot_size${v} FROM material ORDER BY code`),
    receipts: await q(
      `SELECT m.code, DATE_FORMAT(r.week_start, '%Y-%m-%d') AS week, r.qty, r.reference FROM scheduled_receipt r JOIN material m ON m.id = r.material_id ORDER BY m.code, week, r.reference`,
    ),
    bom: await q(
      `SELECT p.code AS parent, b.position, c.code AS product, m.code AS material, b.qty_per, b.scrap_pct
         FROM bom_line b JOIN product p ON p.id = b.parent_product_id LEFT JOIN product c ON c.id = b.component_product_id LEFT JOIN material m ON m.id = b.material_id
        ORDER BY p.code, b.position`,
    ),
    routings: await q(
      `SELECT p.code AS product, r.sequence, w.code AS work_center, r.hours_per_unit, r.setup_hours FROM routing_step r JOIN product p ON p.id = r.product_id JOIN work_center w ON w.id = r.work_center_id ORDER BY p.code, r.sequence`,
    ),
    firm: await q(`SELECT p.code, DATE_FORMAT(f.week_start, '%Y-%m-%d') AS week, f.order_ref, f.qty${v.replace('version', 'f.version')} FROM firm_order f JOIN product p ON p.id = f.product_id ORDER BY p.code, week, f.order_ref`),
    forecast: await q(`SELECT p.code, DATE_FORMAT(f.week_start, '%Y-%m-%d') AS week, f.qty${v.replace('version', 'f.version')} FROM demand_forecast f JOIN product p ON p.id = f.product_id ORDER BY p.code, week`),
  };
}
