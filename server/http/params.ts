import { badRequest } from './errors';

/** Parses a positive integer route parameter such as `:id`, or answers 400. */
export function parseId(value: string | string[] | undefined, name = 'id'): number {
  const text = Array.isArray(value) ? value[0] : value;
  const id = Number(text);
  if (!text || !/^\d+$/.test(text) || !Number.isSafeInteger(id) || id < 1) {
    throw badRequest(`${name} must be a positive whole number.`, { [name]: 'must be a positive whole number' });
  }
  return id;
}
