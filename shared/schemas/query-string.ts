import type { z } from 'zod';

// Decimal notation only: `Number()` alone would also read `0x10` as 16 and a blank as 0.
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Preprocessor for one query-string parameter: an empty (or blank) value means "not given", which is
 * what a form sends when a field is cleared; a repeated parameter is refused rather than silently
 * reduced to one of its values. Use with `z.preprocess(queryText, schema.optional())`.
 *
 * @param value the parsed query value (string, array of strings or undefined)
 * @param ctx the zod refinement context, to report a repeated parameter
 * @returns the trimmed text, or undefined
 * @example z.preprocess(queryText, z.string().optional()).parse('  ') // undefined
 */
export function queryText(value: unknown, ctx: z.RefinementCtx): unknown {
  if (Array.isArray(value)) {
    ctx.addIssue({ code: 'custom', message: 'must be given once' });
    return undefined;
  }
  if (typeof value !== 'string') return value;
  const text = value.trim();
  return text === '' ? undefined : text;
}

/**
 * Like {@link queryText}, then a decimal number written as text becomes a number; anything else is
 * passed on unchanged so the number schema refuses it with its own message.
 *
 * @param value the parsed query value
 * @param ctx the zod refinement context
 * @returns a number, the unchanged text, or undefined
 * @example z.preprocess(queryNumberText, z.number().optional()).parse('2.5') // 2.5
 */
export function queryNumberText(value: unknown, ctx: z.RefinementCtx): unknown {
  const text = queryText(value, ctx);
  return typeof text === 'string' && DECIMAL.test(text) ? Number(text) : text;
}
