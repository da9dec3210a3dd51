import { z } from 'zod';
import { experimentSchema } from './versions';

/** The current version's JSON Schema (draft 2020-12), for editors and other tools. */
export function experimentJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(experimentSchema, { unrepresentable: 'any' }),
    title: 'Fall Line experiment file (.fall.json)',
  };
}
