import { cleanRemembered, rememberedFields, type AssayConditionsValues } from './assay-form';

// Per user, so that two people sharing a bench computer each get their own last conditions back.
const storageKey = (userId: number) => `kcatalog:assay-conditions:user-${userId}`;

/** The conditions this user saved an assay with last, or nothing (also when storage is unavailable). */
export function loadRememberedConditions(userId: number): Partial<AssayConditionsValues> {
  try {
    const stored = window.localStorage.getItem(storageKey(userId));
    return stored === null ? {} : cleanRemembered(JSON.parse(stored));
  } catch {
    // Private browsing, a full quota or a hand-edited entry: start from blank conditions.
    return {};
  }
}

/** Remembers the conditions of an assay that was saved. */
export function rememberConditions(userId: number, values: AssayConditionsValues): void {
  const kept = Object.fromEntries(rememberedFields.map((field) => [field, values[field]]));
  try {
    window.localStorage.setItem(storageKey(userId), JSON.stringify(kept));
  } catch {
    // Not remembering is harmless; the form still works.
  }
}
