/*
 * Loaded by index.html before the app's bundle, as a plain script (the bundle's modules only
 * run once all of Vue and ant-design-vue has arrived): starts the reads a fresh page load
 * always waits for, who is signed in and, on a bin page, the bin, so that a phone opening a
 * label's URL has both answers by the time the router asks. src/api/early.ts takes them.
 */
(function () {
  function get(path) {
    var answer = fetch(path, { headers: { accept: 'application/json' }, credentials: 'same-origin' })
      .then(function (res) { return res.ok ? res.json() : Promise.reject(new Error(String(res.status))) })
    answer.catch(function () {}) // a failure is asked again by the app, through request()
    return answer
  }
  var bin = /^\/bins\/([^/]+)\/?$/.exec(location.pathname)
  window.binwrightEarly = {
    session: get('/api/auth/session'),
    bin: bin ? { code: decodeURIComponent(bin[1]), at: Date.now(), answer: get('/api/bins/' + bin[1]) } : undefined,
  }
})()
