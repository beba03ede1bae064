// The practice page's own style and script, kept as fixed strings so the page's
// Content-Security-Policy can allow exactly them by hash. The script reads the plan from the JSON
// data block and only ever puts text on screen with textContent.

export const PAGE_STYLE = `
html,body{margin:0;height:100%;background:#000;color:#fff;font-family:system-ui,"Segoe UI",Arial,sans-serif}
body{display:flex;flex-direction:column;min-height:100vh}
main{flex:1;display:flex;flex-direction:column;justify-content:center;padding:2vh 4vw}
#count{font-size:clamp(1.2rem,2.6vw,2rem);margin:0 0 2vh;color:#fff}
#item{font-size:clamp(2.6rem,8.5vw,8rem);line-height:1.3;font-weight:700;margin:0;word-spacing:.15em}
#item .w{padding:0 .08em;border-radius:.12em}
#item .w.lit{background:#ffd400;color:#000}
#item .w.said{color:#fff;text-decoration:underline;text-decoration-thickness:.06em;text-underline-offset:.14em}
#pacer{height:1.4rem;margin:4vh 0 0;border:3px solid #fff;border-radius:.7rem;overflow:hidden}
#pacer.off{visibility:hidden}
#pacer-fill{height:100%;width:0;background:#ffd400}
#turn{font-size:clamp(1.6rem,4vw,3rem);min-height:1.3em;margin:2vh 0 0;color:#ffd400}
nav{display:flex;gap:2vw;padding:2vh 4vw}
nav button{flex:1;min-height:5.5rem;font-size:clamp(1.3rem,3vw,2.2rem);font-weight:700;background:#fff;color:#000;border:4px solid #fff;border-radius:1rem;touch-action:manipulation}
nav button:focus-visible{outline:6px solid #ffd400;outline-offset:3px}
footer{padding:1vh 4vw 2vh;font-size:.95rem;color:#ddd}
footer p{margin:.3em 0}
`;

export const PAGE_SCRIPT = `
(function () {
  'use strict';
  var data = JSON.parse(document.getElementById('plan').textContent);
  var items = data.items;
  var $ = function (id) { return document.getElementById(id); };
  var itemEl = $('item'), countEl = $('count'), turnEl = $('turn'), playBtn = $('play');
  var pacer = $('pacer'), fill = $('pacer-fill');
  var index = 0, done = {}, doneCount = 0, timers = [], audio = null, playing = false, t0 = 0, raf = 0, spans = [];
  // What the page did, for tests and for the curious: word onsets as lit, in ms from the start.
  var hooks = window.rungsPractice = { log: [], finished: 0, index: 0 };

  function count() {
    countEl.textContent = 'Item ' + (index + 1) + ' of ' + items.length + ' \\u00b7 ' + doneCount + ' done';
  }
  function stop() {
    timers.forEach(clearTimeout);
    timers = [];
    cancelAnimationFrame(raf);
    if (audio) { audio.pause(); audio = null; }
    playing = false;
    playBtn.textContent = '\\u25b6 Start';
  }
  function show() {
    stop();
    var it = items[index];
    itemEl.textContent = '';
    spans = [];
    it.parts.forEach(function (p) {
      if (p.w < 0) { itemEl.appendChild(document.createTextNode(p.t)); return; }
      var s = document.createElement('span');
      s.className = 'w';
      s.textContent = p.t;
      spans[p.w] = s;
      itemEl.appendChild(s);
    });
    fill.style.width = '0';
    turnEl.textContent = '';
    hooks.index = index;
    count();
  }
  function light(k) {
    var now = performance.now() - t0;
    hooks.log.push({ item: index, word: k, planned: items[index].words[k].at, actual: now });
    if (k > 0) { spans[k - 1].classList.remove('lit'); spans[k - 1].classList.add('said'); }
    spans[k].classList.add('lit');
  }
  function finish() {
    stop();
    spans.forEach(function (s) { s.classList.remove('lit'); s.classList.add('said'); });
    turnEl.textContent = '';
    if (!done[index]) { done[index] = true; doneCount++; }
    hooks.finished++;
    count();
  }
  function pace() {
    var it = items[index];
    var f = Math.min(1, (performance.now() - t0) / Math.max(1, it.model));
    fill.style.width = (f * 100).toFixed(2) + '%';
    if (f < 1 && playing) raf = requestAnimationFrame(pace);
  }
  function play() {
    stop();
    var it = items[index];
    spans.forEach(function (s) { s.classList.remove('lit', 'said'); });
    turnEl.textContent = '';
    playing = true;
    playBtn.textContent = '\\u25a0 Stop';
    t0 = performance.now();
    if (it.audio) { audio = new Audio(it.audio); audio.play().catch(function () {}); }
    // A word due now is lit at once; later ones each get their own timer from the same start, so a
    // late timer never delays the words after it.
    it.words.forEach(function (w, k) {
      if (w.at <= 0) light(k);
      else timers.push(setTimeout(function () { light(k); }, w.at - (performance.now() - t0)));
    });
    if (it.turn > it.model) {
      timers.push(setTimeout(function () {
        if (spans.length) { spans[spans.length - 1].classList.remove('lit'); spans[spans.length - 1].classList.add('said'); }
        turnEl.textContent = 'Your turn';
      }, it.model));
    }
    timers.push(setTimeout(finish, it.turn));
    raf = requestAnimationFrame(pace);
  }
  function go(step) {
    var next = Math.min(items.length - 1, Math.max(0, index + step));
    if (next !== index) { index = next; show(); }
  }
  var actions = {
    play: function () { if (playing) stop(); else play(); },
    repeat: play,
    next: function () { go(1); },
    prev: function () { go(-1); },
    pacer: function () { pacer.classList.toggle('off'); }
  };
  $('play').addEventListener('click', function (e) { e.currentTarget.blur(); actions.play(); });
  $('repeat').addEventListener('click', function (e) { e.currentTarget.blur(); actions.repeat(); });
  $('next').addEventListener('click', function (e) { e.currentTarget.blur(); actions.next(); });
  $('prev').addEventListener('click', function (e) { e.currentTarget.blur(); actions.prev(); });
  var keys = { ' ': 'play', Enter: 'play', r: 'repeat', R: 'repeat', ArrowRight: 'next', PageDown: 'next', n: 'next', ArrowLeft: 'prev', PageUp: 'prev', p: 'prev', v: 'pacer', V: 'pacer' };
  document.addEventListener('keydown', function (e) {
    var a = keys[e.key];
    if (!a || e.altKey || e.ctrlKey || e.metaKey) return;
    e.preventDefault();
    if (!e.repeat) actions[a]();
  });
  show();
})();
`;
