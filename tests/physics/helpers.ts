/**
 * Helpers of the physics tests.
 *
 * @module
 */

export { close } from "../close.ts";
