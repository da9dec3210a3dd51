/** Shape checks for specs read from JSON, with messages that say where and what. */

export function checkConstants(where: string, value: unknown): Record<string, number> | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new Error(`${where}: constants must be an object of numbers, got ${Array.isArray(value) ? 'an array' : String(value)}`);
  }
  for (const [name, v] of Object.entries(value)) {
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new Error(`${where}: constant ${name} must be a finite number, got ${JSON.stringify(v) ?? String(v)}`);
    }
  }
  return value as Record<string, number>;
}

export function checkString(where: string, field: string, value: unknown): string {
  if (typeof value !== 'string') throw new Error(`${where}: ${field} must be a string, got ${value === undefined ? 'nothing' : typeof value}`);
  return value;
}
