// node-fetch 3 is ESM-only, which CommonJS Jest cannot load. citation-js requires it for fetching
// URL inputs, which Thalpos never asks for (inputs are parsed with a forced type); Node's own
// fetch stands in under Jest. Outside Jest, Node 20.19+ loads the real package.
module.exports = {
  __esModule: true,
  default: globalThis.fetch,
  Headers: globalThis.Headers,
  Request: globalThis.Request,
  Response: globalThis.Response,
};
