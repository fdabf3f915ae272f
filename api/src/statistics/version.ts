/**
 * Version of the basis-value engine, carried by every result so that an
 * allowable can be re-derived with the same procedures. Raise it whenever a
 * change could alter any number or decision the engine returns.
 */
export const ENGINE_VERSION = 'plyledger-statistics 1.0.0';
