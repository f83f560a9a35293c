/**
 * Notebook displays of agreement results.
 *
 * @module
 */
export {};
