import type { EntityManager } from 'typeorm';
import type { CalendarWeek, Material, PlantSettings, Product, ScheduledReceipt, WorkCenter } from '@millrace/contracts';
import { listDemandBetween, type StoredFirmOrder, type StoredForecast } from '../demand/demand.repository';
import { listAllMaterials, listAllReceipts } from '../materials/materials.repository';
import { listAllProducts } from '../products/products.repository';
import { readPlantSettings } from '../settings/settings.repository';
import { listAllWorkCenters, listCalendarWeeksBetween } from '../work-centers/work-centers.repository';

/** Every row the planning data is built from, as plain objects keyed by ids. */
export interface MasterDataRows {
  settings: PlantSettings;
  products: Product[];
  bom: Array<{ parentProductId: number; componentProductId: number | null; materialId: number | null; qtyPer: number; scrapPct: number }>;
  routings: Array<{ productId: number; sequence: number; workCenterId: number; hoursPerUnit: number; setupHours: number }>;
  workCenters: WorkCenter[];
  calendar: Array<CalendarWeek & { workCenterId: number }>;
  materials: Material[];
  receipts: Array<ScheduledReceipt & { materialId: number }>;
  firmOrders: StoredFirmOrder[];
  forecasts: StoredForecast[];
}

/**
 * Reads the current master data and the demand and calendar of weeks [from, to). Run it inside a
 * transaction (REPEATABLE READ) so every table is read from the same snapshot.
 */
export async function readMasterDataRows(db: EntityManager, from: string, to: string): Promise<MasterDataRows> {
  const settings = await readPlantSettings(db);
  const products = await listAllProducts(db);
  const bom = (await db.query(
    `SELECT parent_product_id AS parentProductId, component_product_id AS componentProductId, material_id AS materialId, qty_per AS qtyPer, scrap_pct AS scrapPct
       FROM bom_line ORDER BY parent_product_id, position, id`,
  )) as Array<{ parentProductId: number; componentProductId: number | null; materialId: number | null; qtyPer: string; scrapPct: string }>;
  const routings = (await db.query(
    `SELECT product_id AS productId, sequence, work_center_id AS workCenterId, hours_per_unit AS hoursPerUnit, setup_hours AS setupHours
       FROM routing_step ORDER BY product_id, sequence`,
  )) as Array<{ productId: number; sequence: number; workCenterId: number; hoursPerUnit: string; setupHours: string }>;
  const workCenters = await listAllWorkCenters(db);
  const calendar = await listCalendarWeeksBetween(db, from, to);
  const materials = await listAllMaterials(db);
  const receipts = await listAllReceipts(db);
  const demand = await listDemandBetween(db, from, to);
  return {
    settings,
    products,
    bom: bom.map((b) => ({ parentProductId: b.parentProductId, componentProductId: b.componentProductId, materialId: b.materialId, qtyPer: Number(b.qtyPer), scrapPct: Number(b.scrapPct) })),
    routings: routings.map((r) => ({ productId: r.productId, sequence: r.sequence, workCenterId: r.workCenterId, hoursPerUnit: Number(r.hoursPerUnit), setupHours: Number(r.setupHours) })),
    workCenters,
    calendar,
    materials,
    receipts,
    firmOrders: demand.firm,
    forecasts: demand.forecast,
  };
}
