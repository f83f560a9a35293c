/**
 * Notebook displays of chamber results.
 *
 * @module
 */
export {};
