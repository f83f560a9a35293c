/**
 * Notebook displays of doppler results.
 *
 * @module
 */
export {};
