let counter = 0;

/** Short unique ids for run configs, launches and grid requests (unique within a page session). */
export function freshId(prefix: string): string {
  counter += 1;
  return `${prefix}${Date.now().toString(36)}${counter.toString(36)}`;
}
