import { z } from 'zod';

/**
 * Number rules for master data. The bounds match the DECIMAL columns that store them, so a value
 * the schema accepts always fits the database.
 */
const finite = (what: string) => z.number({ error: `Enter ${what} as a number.` });

/** Quantities of stock, demand, receipts (DECIMAL(14,4)). */
export const quantitySchema = finite('the quantity')
  .min(0, 'A quantity cannot be negative.')
  .max(1e9, 'A quantity can be at most 1,000,000,000.');

/** Money per unit or per hour (DECIMAL(14,4)). */
export const moneySchema = finite('the amount')
  .min(0, 'An amount cannot be negative.')
  .max(1e9, 'An amount can be at most 1,000,000,000.');

/** Quantity of a component per unit of its parent (DECIMAL(16,6)); must be positive. */
export const qtyPerSchema = finite('the quantity per unit')
  .gt(0, 'The quantity per unit must be more than 0.')
  .max(1e6, 'The quantity per unit can be at most 1,000,000.');

/** Scrap percentage 0 ≤ s < 100 (DECIMAL(6,3)). */
export const scrapPctSchema = finite('the scrap percentage')
  .min(0, 'Scrap cannot be negative.')
  .lt(100, 'Scrap must be below 100 %.');

/** Hours (DECIMAL(12,4)). */
export const hoursSchema = finite('the hours')
  .min(0, 'Hours cannot be negative.')
  .max(1e5, 'Hours can be at most 100,000.');
