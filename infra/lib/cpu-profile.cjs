// Preloaded into the API by `npm run load` when LOAD_CPU_PROF names a folder (node --require): the V8 CPU
// profiler (node:inspector) runs from start-up, and each SIGWINCH (Nest's shutdown hooks take SIGUSR2)
// writes what it sampled since the last one to
// <folder>/<n>.cpuprofile (open it in Chrome's DevTools, or let load.mjs sum it by function), so every phase
// of the load run gets a profile of its own. Nothing of this is loaded when the variable is not set.
const { Session } = require('node:inspector');
const { mkdirSync, writeFileSync } = require('node:fs');
const path = require('node:path');

const dir = process.env.LOAD_CPU_PROF;
if (dir) {
  mkdirSync(dir, { recursive: true });
  const session = new Session();
  session.connect();
  const post = (method, params) =>
    new Promise((resolve, reject) =>
      session.post(method, params, (err, result) => (err ? reject(err) : resolve(result))),
    );
  let n = 0;
  const start = () => post('Profiler.start');
  void post('Profiler.enable')
    .then(() => post('Profiler.setSamplingInterval', { interval: 500 }))
    .then(start);
  process.on('SIGWINCH', () => {
    void post('Profiler.stop').then(({ profile }) => {
      n += 1;
      writeFileSync(path.join(dir, `${n}.cpuprofile`), JSON.stringify(profile));
      return start();
    });
  });
}
