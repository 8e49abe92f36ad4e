import { PlantSettingsEntity } from './plant-settings.entity';
import { ProductEntity } from './product.entity';
import { BomLineEntity } from './bom-line.entity';
import { RoutingStepEntity } from './routing-step.entity';
import { WorkCenterEntity } from './work-center.entity';
import { CalendarWeekEntity } from './calendar-week.entity';
import { MaterialEntity } from './material.entity';
import { ScheduledReceiptEntity } from './scheduled-receipt.entity';
import { FirmOrderEntity } from './firm-order.entity';
import { DemandForecastEntity } from './demand-forecast.entity';

/** Entities of the plant's master data and demand (registered in data-source.ts). */
export const masterDataEntities = [
  PlantSettingsEntity,
  ProductEntity,
  BomLineEntity,
  RoutingStepEntity,
  WorkCenterEntity,
  CalendarWeekEntity,
  MaterialEntity,
  ScheduledReceiptEntity,
  FirmOrderEntity,
  DemandForecastEntity,
];
