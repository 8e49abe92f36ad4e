import type { EntityManager } from 'typeorm';
import type { Material, PlantSettings, Product, WorkCenter } from '@millrace/contracts';
import { BomLineEntity } from '../db/entities/bom-line.entity';
import { ProductEntity } from '../db/entities/product.entity';
import { RoutingStepEntity } from '../db/entities/routing-step.entity';
import { listDemandBetween, type StoredFirmOrder, type StoredForecast } from '../demand/demand.repository';
import { listAllMaterials, listAllReceipts } from '../materials/materials.repository';
import { toProduct } from '../products/products.repository';
import { readPlantSettings } from '../settings/settings.repository';
import { listAllWorkCenters, listCalendarWeeksBetween } from '../work-centers/work-centers.repository';
import type { CalendarWeek, ScheduledReceipt } from '@millrace/contracts';

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
  const products = (await db.getRepository(ProductEntity).find({ order: { code: 'ASC' } })).map(toProduct);
  const bom = await db.getRepository(BomLineEntity).find({ order: { parentProductId: 'ASC', position: 'ASC', id: 'ASC' } });
  const routings = await db.getRepository(RoutingStepEntity).find({ order: { productId: 'ASC', sequence: 'ASC' } });
  const workCenters = await listAllWorkCenters(db);
  const calendar = await listCalendarWeeksBetween(db, from, to);
  const materials = await listAllMaterials(db);
  const receipts = await listAllReceipts(db);
  const demand = await listDemandBetween(db, from, to);
  return {
    settings,
    products,
    bom: bom.map((b) => ({ parentProductId: b.parentProductId, componentProductId: b.componentProductId, materialId: b.materialId, qtyPer: b.qtyPer, scrapPct: b.scrapPct })),
    routings: routings.map((r) => ({ productId: r.productId, sequence: r.sequence, workCenterId: r.workCenterId, hoursPerUnit: r.hoursPerUnit, setupHours: r.setupHours })),
    workCenters,
    calendar,
    materials,
    receipts,
    firmOrders: demand.firm,
    forecasts: demand.forecast,
  };
}
