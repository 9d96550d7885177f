// The module each pool thread loads (piscina calls its default export per
// task). Built to dist/node/pool-worker.js; run from source through tsx.
export { runTask as default } from "./pool-tasks.js";
