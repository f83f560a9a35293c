// A stand-in for the 'debug' package (same factory API, always disabled). The original reads
// process.env when it loads, so importing the library would need --allow-env; its messages are
// off unless DEBUG is set, so behaviour is unchanged. See DEVELOPERS.md, "Dependencies".
"use strict";
function createDebug(namespace) {
  function debug() {}
  debug.namespace = String(namespace);
  debug.enabled = false;
  debug.log = function () {};
  return debug;
}
createDebug.enable = function () {};
createDebug.disable = function () {};
createDebug.enabled = function () {
  return false;
};
createDebug.names = [];
createDebug.skips = [];
createDebug.formatters = {};
module.exports = createDebug;
module.exports.default = createDebug;
