/** Named constants typed as "a = 1, b = 100" (commas or semicolons between, any spacing). */
export function parseConstants(text: string): Record<string, number> | string {
  const out: Record<string, number> = {};
  const parts = text.split(/[,;]/).map((p) => p.trim()).filter(Boolean);
  for (const part of parts) {
    const m = /^([A-Za-z_][A-Za-z0-9_]*)\s*=\s*(.+)$/.exec(part);
    if (!m) return `named constants: "${part}" should look like name = number`;
    const value = Number(m[2]);
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(m[2].trim()) || !Number.isFinite(value))
      return `named constants: the value of ${m[1]} must be a finite number, got "${m[2]}"`;
    if (m[1] in out) return `named constants: ${m[1]} is given twice`;
    out[m[1]] = value;
  }
  return out;
}

export function formatConstants(c: Record<string, number> | undefined): string {
  return c ? Object.entries(c).map(([k, v]) => `${k} = ${v}`).join(', ') : '';
}
