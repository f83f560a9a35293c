/** Types of the vendored mathjs bundle (vendor/build.ts): mathjs's own `all` and `create`. */
export { all, create } from "mathjs";
