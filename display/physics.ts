/**
 * Notebook displays of physics results.
 *
 * @module
 */
export {};
