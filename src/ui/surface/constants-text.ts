/** Named constants typed as "a = 1, b = 100" (commas or semicolons between, any spacing). */
export function parseConstants(text: string): Record<string, number> | string {
  // A Map, so names such as `constructor` or `__proto__` are ordinary names (a plain object has them).
  const out = new Map<string, number>();
  const parts = text.split(/[,;]/).map((p) => p.trim()).filter(Boolean);
  for (const part of parts) {
    const m = /^([A-Za-z_][A-Za-z0-9_]*)\s*=\s*(.+)$/.exec(part);
    if (!m) return `named constants: "${part}" should look like name = number`;
    const value = Number(m[2]);
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(m[2].trim()) || !Number.isFinite(value))
      return `named constants: the value of ${m[1]} must be a finite number, got "${m[2]}"`;
    if (out.has(m[1])) return `named constants: ${m[1]} is given twice`;
    out.set(m[1], value);
  }
  return Object.fromEntries(out);
}

export function formatConstants(c: Record<string, number> | undefined): string {
  return c ? Object.entries(c).map(([k, v]) => `${k} = ${v}`).join(', ') : '';
}
