import type { FieldError } from '@millrace/contracts';
import type { z } from 'zod';

/** Turns zod issues into `{path: 'rows.3.qty', message}` entries; unknown keys get one entry each. */
export function fieldsFromZod(error: z.ZodError, prefix?: string): FieldError[] {
  const fields: FieldError[] = [];
  for (const issue of error.issues) {
    const base = [...(prefix ? [prefix] : []), ...issue.path.map(String)];
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        fields.push({ path: [...base, key].join('.'), message: `Unknown field "${key}".` });
      }
    } else {
      fields.push({ path: base.join('.'), message: issue.message });
    }
  }
  return fields;
}
