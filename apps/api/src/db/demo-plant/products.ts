import type { ProductCreate } from '@millrace/contracts';

/** A BOM line by code: `p:` a component product, `m:` a material. */
type Line = [component: string, qtyPer: number, scrapPct?: number];
/** A routing step: work center code, hours per unit, setup hours. */
type Step = [workCenter: string, hoursPerUnit: number, setupHours?: number];

export interface DemoProduct extends ProductCreate {
  bom: Line[];
  routing: Step[];
  /** typical weekly demand of a finished good, for the demand generator (demo only) */
  weeklyRate?: number;
}

const finished = (code: string, name: string, price: number, family: string, rest: Partial<DemoProduct>): DemoProduct => ({
  code,
  name,
  unit: 'pcs',
  kind: 'finished',
  price,
  holdingCostRatePct: 24,
  safetyStock: 0,
  batchMultiple: 1,
  openingStock: 0,
  latePenalty: Math.round(price * 0.02 * 100) / 100,
  family,
  active: true,
  bom: [],
  routing: [],
  ...rest,
});

const sub = (code: string, name: string, family: string, rest: Partial<DemoProduct>): DemoProduct => ({
  code,
  name,
  unit: 'pcs',
  kind: 'subassembly',
  price: 0,
  holdingCostRatePct: 24,
  safetyStock: 0,
  batchMultiple: 1,
  openingStock: 0,
  latePenalty: 0,
  family,
  active: true,
  bom: [],
  routing: [],
  ...rest,
});

/**
 * Twelve finished goods and fourteen sub-assemblies (demo data). Levels: a table is made from a
 * top, which is made from glued panels, which are made from boards (table → top → panel → timber:
 * three product levels above the materials); sideboards use a carcass built from panels.
 */
export const demoProducts: DemoProduct[] = [
  // Level 3: glued panels from boards
  sub('GLP-OAK', 'Glued oak panel 0.5 m2', 'panels', {
    batchMultiple: 4,
    bom: [['m:LUM-OAK-27', 0.55, 8], ['m:GLU-PVA', 0.05], ['m:DOW-8', 6]],
    routing: [['SAW', 0.2, 0.5], ['PRESS', 0.25, 0.5], ['SAND', 0.1]],
  }),
  sub('GLP-ASH', 'Glued ash panel 0.5 m2', 'panels', {
    batchMultiple: 4,
    bom: [['m:LUM-ASH-27', 0.55, 8], ['m:GLU-PVA', 0.05], ['m:DOW-8', 6]],
    routing: [['SAW', 0.2, 0.5], ['PRESS', 0.25, 0.5], ['SAND', 0.1]],
  }),
  // Level 2: tops, legs, frames, carcasses
  sub('TOP-OAK-180', 'Oak table top 180 × 90', 'tops', {
    bom: [['p:GLP-OAK', 3.3], ['m:OIL-HARD', 0.15]],
    routing: [['CNC', 1.01, 0.75], ['SAND', 0.6], ['SPRAY', 0.47]],
  }),
  sub('TOP-OAK-140', 'Oak table top 140 × 85', 'tops', {
    bom: [['p:GLP-OAK', 2.4], ['m:OIL-HARD', 0.12]],
    routing: [['CNC', 0.87, 0.75], ['SAND', 0.5], ['SPRAY', 0.38]],
  }),
  sub('TOP-ASH-120', 'Ash table top 120 × 80', 'tops', {
    bom: [['p:GLP-ASH', 2], ['m:LAC-WB', 0.12]],
    routing: [['CNC', 0.72, 0.75], ['SAND', 0.45], ['SPRAY', 0.34]],
  }),
  sub('LEG-OAK', 'Turned oak table leg', 'legs', {
    batchMultiple: 8,
    bom: [['m:LUM-OAK-45', 0.8, 10]],
    routing: [['SAW', 0.05], ['TURN', 0.3, 1], ['SAND', 0.1]],
  }),
  sub('LEG-ASH', 'Tapered ash leg', 'legs', {
    batchMultiple: 8,
    bom: [['m:LUM-ASH-45', 0.75, 10]],
    routing: [['SAW', 0.05], ['CNC', 0.17, 0.5], ['SAND', 0.08]],
  }),
  sub('FRM-CHR-OAK', 'Oak chair frame', 'chairs', {
    bom: [['m:LUM-OAK-45', 3.2, 12], ['m:DOW-8', 16], ['m:GLU-PVA', 0.08]],
    routing: [['SAW', 0.15], ['CNC', 0.65, 1], ['ASM', 0.52], ['SAND', 0.25]],
  }),
  sub('FRM-CHR-ASH', 'Ash chair frame', 'chairs', {
    bom: [['m:LUM-ASH-45', 3, 12], ['m:DOW-8', 16], ['m:GLU-PVA', 0.08]],
    routing: [['SAW', 0.15], ['CNC', 0.65, 1], ['ASM', 0.52], ['SAND', 0.25]],
  }),
  sub('SEAT-UPH', 'Upholstered seat pad', 'chairs', {
    bom: [['m:PLY-BIRCH-12', 0.2, 5], ['m:FOAM-40', 0.22, 5], ['m:FAB-WOOL', 0.35, 10], ['m:WEB-ELAST', 1.2], ['m:STP-UPH', 60]],
    routing: [['CNC', 0.12], ['UPH', 1.16, 0.25]],
  }),
  sub('DRW-BOX', 'Drawer box, birch ply', 'cabinets', {
    bom: [['m:PLY-BIRCH-12', 0.45, 6], ['m:SLD-450', 1], ['m:SCR-4X40', 12], ['m:GLU-PVA', 0.03]],
    routing: [['CNC', 0.36, 0.5], ['EDGE', 0.53], ['ASM', 0.26]],
  }),
  sub('CAR-SBD', 'Sideboard carcass', 'cabinets', {
    bom: [['p:GLP-OAK', 2], ['m:PLY-BIRCH-18', 1.1, 6], ['m:VEN-OAK', 1.4, 8], ['m:EDG-OAK-22', 9], ['m:CAM-LOCK', 12]],
    routing: [['CNC', 1.59, 1], ['EDGE', 1.75], ['SAND', 0.6], ['SPRAY', 0.68]],
  }),
  sub('DOOR-SBD', 'Sideboard door', 'cabinets', {
    bom: [['m:MDF-18', 0.35, 6], ['m:VEN-OAK', 0.75, 8], ['m:EDG-OAK-22', 2.6], ['m:HNG-CUP', 2]],
    routing: [['CNC', 0.43, 0.5], ['EDGE', 0.7], ['SPRAY', 0.3]],
  }),
  sub('RAIL-BED', 'Oak bed side rail', 'beds', {
    bom: [['m:LUM-OAK-27', 0.45, 8], ['m:FTG-BED', 0.5]],
    routing: [['SAW', 0.1], ['CNC', 0.51, 0.5], ['SAND', 0.25], ['SPRAY', 0.21]],
  }),
  // Level 1: finished goods
  finished('TBL-OAK-180', 'Oak dining table 180', 1490, 'tables', {
    weeklyRate: 6,
    safetyStock: 2,
    openingStock: 4,
    bom: [['p:TOP-OAK-180', 1], ['p:LEG-OAK', 4], ['m:BRK-CORNER', 4], ['m:SCR-4X40', 16], ['m:BOX-TBL', 1], ['m:FELT-PAD', 4]],
    routing: [['ASM', 1.04, 0.5], ['SPRAY', 0.26], ['PACK', 0.48]],
  }),
  finished('TBL-OAK-140', 'Oak dining table 140', 1180, 'tables', {
    weeklyRate: 5,
    safetyStock: 2,
    openingStock: 3,
    bom: [['p:TOP-OAK-140', 1], ['p:LEG-OAK', 4], ['m:BRK-CORNER', 4], ['m:SCR-4X40', 16], ['m:BOX-TBL', 1], ['m:FELT-PAD', 4]],
    routing: [['ASM', 0.96, 0.5], ['SPRAY', 0.21], ['PACK', 0.48]],
  }),
  finished('TBL-ASH-120', 'Ash kitchen table 120', 790, 'tables', {
    weeklyRate: 4,
    openingStock: 2,
    bom: [['p:TOP-ASH-120', 1], ['p:LEG-ASH', 4], ['m:BRK-CORNER', 4], ['m:SCR-4X40', 16], ['m:BOX-TBL', 1], ['m:GLD-NYL', 4]],
    routing: [['ASM', 0.78, 0.5], ['SPRAY', 0.17], ['PACK', 0.42]],
  }),
  finished('CHR-OAK', 'Oak dining chair', 340, 'chairs', {
    weeklyRate: 24,
    safetyStock: 8,
    openingStock: 16,
    batchMultiple: 2,
    bom: [['p:FRM-CHR-OAK', 1], ['m:OIL-HARD', 0.06], ['m:BOX-CHR', 1], ['m:FELT-PAD', 4], ['m:SND-P240', 2]],
    routing: [['SPRAY', 0.26], ['PACK', 0.18]],
  }),
  finished('CHR-ASH-UPH', 'Ash chair, upholstered seat', 390, 'chairs', {
    weeklyRate: 16,
    safetyStock: 6,
    openingStock: 10,
    batchMultiple: 2,
    bom: [['p:FRM-CHR-ASH', 1], ['p:SEAT-UPH', 1], ['m:LAC-WB', 0.05], ['m:BOX-CHR', 1], ['m:GLD-NYL', 4]],
    routing: [['SPRAY', 0.24], ['UPH', 0.31], ['ASM', 0.13], ['PACK', 0.18]],
  }),
  finished('STL-ASH', 'Ash bar stool', 260, 'chairs', {
    weeklyRate: 6,
    batchMultiple: 2,
    bom: [['p:LEG-ASH', 4], ['p:SEAT-UPH', 1], ['m:LUM-ASH-45', 1.2, 10], ['m:DOW-8', 8], ['m:BOX-CHR', 1]],
    routing: [['CNC', 0.29, 0.5], ['ASM', 0.39], ['SPRAY', 0.21], ['PACK', 0.18]],
  }),
  finished('BEN-OAK', 'Oak bench 160', 560, 'tables', {
    weeklyRate: 3,
    bom: [['p:GLP-OAK', 1.6], ['p:LEG-OAK', 4], ['m:OIL-HARD', 0.1], ['m:BOX-TBL', 1]],
    routing: [['CNC', 0.58, 0.5], ['ASM', 0.52], ['SAND', 0.4], ['SPRAY', 0.3], ['PACK', 0.36]],
  }),
  finished('SBD-OAK', 'Oak sideboard, 2 doors 3 drawers', 1890, 'cabinets', {
    weeklyRate: 2,
    openingStock: 1,
    bom: [['p:CAR-SBD', 1], ['p:DOOR-SBD', 2], ['p:DRW-BOX', 3], ['m:KNB-BRASS', 2], ['m:HDL-BRASS', 3], ['m:BOX-TBL', 1], ['m:WRP-FOAM', 8]],
    routing: [['ASM', 2.17, 0.5], ['PACK', 0.72]],
  }),
  finished('NST-OAK', 'Oak nightstand, 1 drawer', 420, 'cabinets', {
    weeklyRate: 6,
    batchMultiple: 2,
    bom: [['p:GLP-OAK', 0.9], ['p:DRW-BOX', 1], ['m:PLY-BIRCH-18', 0.3, 6], ['m:KNB-BRASS', 1], ['m:BOX-SM', 1], ['m:CAM-LOCK', 4]],
    routing: [['CNC', 0.65, 0.5], ['EDGE', 0.53], ['SAND', 0.3], ['SPRAY', 0.26], ['ASM', 0.43], ['PACK', 0.24]],
  }),
  finished('BKC-PINE', 'Pine bookcase 5 shelves', 310, 'cabinets', {
    weeklyRate: 5,
    bom: [['m:LUM-PINE-20', 2.4, 8], ['m:SCR-4X40', 24], ['m:STN-WAL', 0.15], ['m:BOX-TBL', 1]],
    routing: [['SAW', 0.35, 0.5], ['CNC', 0.43, 0.5], ['SAND', 0.4], ['SPRAY', 0.26], ['ASM', 0.52], ['PACK', 0.36]],
  }),
  finished('BED-OAK-160', 'Oak bed frame 160', 1350, 'beds', {
    weeklyRate: 2,
    openingStock: 1,
    bom: [['p:RAIL-BED', 2], ['p:GLP-OAK', 2.2], ['p:LEG-OAK', 4], ['m:SLT-BED', 1], ['m:FTG-BED', 1], ['m:BOX-TBL', 2]],
    routing: [['CNC', 1.16, 0.75], ['SAND', 0.5], ['SPRAY', 0.38], ['ASM', 1.3], ['PACK', 0.6]],
  }),
  finished('DSK-ASH', 'Ash writing desk', 880, 'tables', {
    weeklyRate: 2,
    bom: [['p:TOP-ASH-120', 1], ['p:LEG-ASH', 4], ['p:DRW-BOX', 1], ['m:HDL-BRASS', 1], ['m:BOX-TBL', 1]],
    routing: [['ASM', 1.13, 0.5], ['PACK', 0.48]],
  }),
];
