/**
 * The arrow shaft's diameter, which the plotting rule (./plotting.ts) needs: a shaft touching a
 * dividing line scores the higher zone (WA Book 3, scoring; from memory), so the same plotted
 * centre can be a 10 with a fat indoor shaft and a 9 with a thin outdoor one.
 *
 * The range covers target arrows in use: thin carbon shafts of about 4 mm up to the fattest
 * indoor shafts, which WA Book 3 caps at 9.3 mm (from memory; check the edition in use), with a
 * little room for wraps and measuring. The default, 5.5 mm, is common practice for an outdoor
 * target shaft, not a rule.
 */
export const SHAFT_DIAMETER_MM = { default: 5.5, min: 4, max: 9.5 } as const;

export type ShaftReading = { ok: true; mm: number } | { ok: false; message: string };

/**
 * Reads a diameter as typed on a phone ("5.5", "5,5", " 6 mm"), to a tenth of a millimetre,
 * or says in words why it cannot be used.
 */
export function readShaftDiameter(typed: string): ShaftReading {
  const text = typed
    .trim()
    .replace(/\s*mm$/i, '')
    .replace(',', '.');
  const mm = /^\d+(\.\d*)?$|^\.\d+$/.test(text) ? Math.round(Number(text) * 10) / 10 : Number.NaN;
  const { min, max } = SHAFT_DIAMETER_MM;
  if (!(mm >= min && mm <= max)) {
    return {
      ok: false,
      message: `Give the shaft's diameter in mm, from ${min} to ${max} (for example 5.5).`,
    };
  }
  return { ok: true, mm };
}
