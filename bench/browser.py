"""Browser figures, measured in Debian's Chromium driven by Playwright against a served build.

- page weight: every response a page load receives, recorded through the DevTools protocol
  (Network domain), with its body size raw and gzip-compressed (level 6, what a compressing web
  server sends); responses answered from the browser cache transfer no body and are counted apart.
  The service worker is blocked here so the figures are the page's own; the offline copy it would
  download in the background after the first visit is reported separately by run.py.
- calculator update: in the page, performance.now() from dispatching an input event on a number
  field to the moment a result's data-value has changed and the page's style and layout are up to
  date (read back at once; painting left out), CPU throttled ×4 (Emulation domain); the floor is a
  form added to the same calculator's page whose handler only copies the input into a data-value,
  timed by the same code on a fresh page of its own, alternating with the calculator's pages. The field changed is the form's first number field (not a material name), and
  its second value is what a person would type, about 10 % more (SECOND_VALUE says why it never has
  three digits after a point). Beside it, the same-writes floor: the texts and data-values that
  update writes, replayed on a copy of the section by a handler with no core and no glue
  (REPLAY_FORM), so the calculator's figure can be read as layout that any page showing those
  results pays, plus what the core and glue add.
- search: the same for the header search box, once its index is loaded.
- first contentful paint of a material page, fresh browser context, CPU throttled ×4.
"""

from __future__ import annotations

import base64
import re
import gzip
import statistics
import threading
from contextlib import contextmanager
from pathlib import Path

CHROMIUM = "/usr/bin/chromium"
CHROMIUM_ARGS = ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                 "--disable-background-networking", "--disable-component-update", "--disable-sync"]
THROTTLE = 4

# The second value of a number field is what a person would type: about 10 % more, to three
# significant digits ("100 m" -> "110 m", "0.736 ohm" -> "0.81 ohm", "20 °C" -> "22 °C"). Never three
# digits after a point ("110.001 m"): the page notes how it read such a number ("read with a decimal
# point as 110.001; for 110001 write 110001"), so the note would come and go each round and the
# figure would time the warning list, not an update. Shared by CALC_TIMER and REPLAY_FORM.
SECOND_VALUE = r"""
const secondValue = (original) => {
  const match = original.trim().match(/^(\d+(?:\.\d+)?)(.*)$/);
  const value = parseFloat(match[1]);
  let number = String(Number((value * 1.1).toPrecision(3)));
  if (/\.\d{3}$/.test(number)) number = String(Number((value * 1.1).toPrecision(2)));
  if (Number(number) === value) number = String(value + 1);
  return number + match[2];
};
"""

# Runs in the page: change a number field of the form back and forth, time each update from
# dispatching the input event until a result's data-value has changed AND the page's style and
# layout are up to date (read back at once, as the next frame would have to compute them before
# showing anything; painting is left out). The floor (FLOOR_FORM) is timed by this same function.
CALC_TIMER = """
async ({name, rounds}) => {""" + SECOND_VALUE + """  const form = document.querySelector(`form[data-calculator="${name}"]`);
  if (!form) return {error: 'no form for ' + name};
  const section = form.closest('section');
  const cells = Array.from(section.querySelectorAll('[data-result]'));
  const snapshot = () => cells.map((cell) => cell.dataset.value === undefined ? '' : cell.dataset.value).join('|');
  const laidOut = () => { void document.documentElement.offsetHeight; return performance.now(); };
  const changed = (before) => new Promise((resolve) => {
    if (snapshot() !== before) { resolve(laidOut()); return; }
    const observer = new MutationObserver(() => {
      if (snapshot() !== before) { observer.disconnect(); resolve(laidOut()); }
    });
    observer.observe(section, {subtree: true, attributes: true, attributeFilter: ['data-value']});
    setTimeout(() => { observer.disconnect(); resolve(null); }, 2000);
  });
  // the number fields in form order; a material field (a list to choose from, e.g. "1350") is a name
  const candidates = Array.from(form.querySelectorAll('input[type=text]'))
    .filter((input) => !input.hasAttribute('list') && /^\\d/.test(input.value.trim()));
  for (const input of candidates) {
    const original = input.value;
    const other = secondValue(original);
    const samples = [];
    for (let i = 0; i < rounds; i++) {
      const before = snapshot();
      void document.documentElement.offsetHeight;  // nothing left over from the last round
      const start = performance.now();
      input.value = i % 2 === 0 ? other : original;
      input.dispatchEvent(new Event('input', {bubbles: true}));
      const end = await changed(before);
      if (end === null) break;
      samples.push(end - start);
      await new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve, 0)));
    }
    if (samples.length === rounds) return {field: input.name, samples};
    input.value = original;
    input.dispatchEvent(new Event('input', {bubbles: true}));
  }
  return {error: 'no number field of ' + name + ' changes a result'};
}
"""

# Runs in the page: the floor, a form whose input handler only copies the input into a result's text
# and data-value (no core, no page glue), added to the page and timed by CALC_TIMER like a calculator.
FLOOR_FORM = """
() => {
  const section = document.createElement('section');
  const form = document.createElement('form');
  form.dataset.calculator = 'bench-floor';
  const input = document.createElement('input');
  input.type = 'text';
  input.name = 'value';
  input.value = '1 m';
  const cell = document.createElement('dd');
  cell.dataset.result = 'value';
  form.append(input);
  section.append(form, cell);
  document.body.append(section);
  form.addEventListener('input', () => { cell.textContent = input.value; cell.dataset.value = input.value; });
}
"""


# Runs in the page: the same-writes floor. The calculator's section is put through one real update to
# ``field``'s second value and back, recording every text of the section and each result's
# data-value in both states; then a copy of the section without the calculator's listeners (a
# cloned node carries none) takes its place, and its input handler only writes the recorded texts
# and data-values that differ, as the page glue does (a text node's characters set in place). So it
# lays out exactly the texts a calculator update lays out, with no core and no glue; timed by
# CALC_TIMER like a calculator.
REPLAY_FORM = """
async ({name, field}) => {""" + SECOND_VALUE + """  const form = document.querySelector(`form[data-calculator="${name}"]`);
  if (!form) return {error: 'no form for ' + name};
  const section = form.closest('section');
  const input = form.querySelector(`[name="${field}"]`);
  const texts = (root) => {
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
    const out = [];
    while (walker.nextNode()) out.push(walker.currentNode);
    return out;
  };
  const cellsOf = (root) => Array.from(root.querySelectorAll('[data-result]'));
  const record = () => ({texts: texts(section).map((node) => node.data),
                         values: cellsOf(section).map((cell) => cell.dataset.value)});
  const settle = async (before) => {
    const deadline = performance.now() + 2000;
    while (performance.now() < deadline && JSON.stringify(record()) === before) {
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  };
  const original = input.value;
  const other = secondValue(original);
  const first = record();
  input.value = other;
  input.dispatchEvent(new Event('input', {bubbles: true}));
  await settle(JSON.stringify(first));
  const second = record();
  input.value = original;
  input.dispatchEvent(new Event('input', {bubbles: true}));
  await settle(JSON.stringify(second));
  if (first.texts.length !== second.texts.length || JSON.stringify(record()) !== JSON.stringify(first)) {
    return {error: 'the update to ' + field + ' does not give back the same page parts, so it cannot be replayed'};
  }
  const copy = section.cloneNode(true);
  section.replaceWith(copy);
  const copyForm = copy.querySelector('form');
  copyForm.dataset.calculator = 'bench-replay';
  const copyInput = copyForm.querySelector(`[name="${field}"]`);
  const copyTexts = texts(copy);
  const copyCells = cellsOf(copy);
  copyForm.addEventListener('input', (event) => {
    if (event.target !== copyInput) return;
    const state = copyInput.value === other ? second : first;
    for (let i = 0; i < copyTexts.length; i++) {
      if (copyTexts[i].data !== state.texts[i]) copyTexts[i].data = state.texts[i];
    }
    for (let i = 0; i < copyCells.length; i++) {
      const value = state.values[i];
      if (copyCells[i].dataset.value === value) continue;
      if (value === undefined) delete copyCells[i].dataset.value; else copyCells[i].dataset.value = value;
    }
  });
  return {field};
}
"""

def floor_times(browser, base: str, page_path: str, rounds: int, reps: int = 1) -> dict:
    """The floor on ``page_path`` (same page, CSS and throttling as a calculator): median over ``reps``
    fresh pages of each page's median."""
    runs = []
    for _ in range(max(1, reps)):
        context, page = throttled_page(browser, f"{base}/{page_path}")
        page.evaluate(FLOOR_FORM)
        result = page.evaluate(CALC_TIMER, {"name": "bench-floor", "rounds": rounds})
        context.close()
        if "error" in result:
            return {"error": result["error"]}
        runs.append(statistics.median(result["samples"]))
    return {"median_ms": statistics.median(runs), "runs_ms": runs}


# Runs in the page: load the search index with a first query, then time each query.
SEARCH_TIMER = """
async ({queries, rounds}) => {
  const input = document.querySelector('form[data-search] input[name=q]');
  const list = input.form.querySelector('.site-search-results');
  input.focus();
  input.value = queries[0];
  input.dispatchEvent(new Event('input', {bubbles: true}));
  const deadline = performance.now() + 30000;
  while (list.hidden && performance.now() < deadline) await new Promise((r) => setTimeout(r, 20));
  if (list.hidden) return {error: 'the search box never showed results for ' + queries[0]};
  const out = {};
  for (const query of queries) {
    const samples = [];
    for (let i = 0; i < rounds; i++) {
      input.value = '';
      input.dispatchEvent(new Event('input', {bubbles: true}));
      await new Promise((r) => setTimeout(r, 0));
      const start = performance.now();
      input.value = query;
      input.dispatchEvent(new Event('input', {bubbles: true}));
      const end = performance.now();
      if (list.hidden) return {error: 'no results for ' + query};
      samples.push(end - start);
    }
    out[query] = samples;
  }
  return {samples: out};
}
"""


@contextmanager
def served(folder: Path):
    from conductor_atlas.serve import make_server
    server = make_server(folder, port=0, quiet=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    try:
        yield f"http://127.0.0.1:{server.server_address[1]}"
    finally:
        server.shutdown()
        server.server_close()


@contextmanager
def chromium():
    from playwright.sync_api import sync_playwright
    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path=CHROMIUM, args=CHROMIUM_ARGS)
        try:
            yield browser
        finally:
            browser.close()


class Recorder:
    """Every network response of one page, through the DevTools protocol."""

    def __init__(self, page) -> None:
        self.page = page
        self.cdp = page.context.new_cdp_session(page)
        self.cdp.send("Network.enable")
        self.responses: dict[str, dict] = {}
        self.cdp.on("Network.responseReceived", self._response)
        self.cdp.on("Network.requestServedFromCache", self._from_cache)
        self.cdp.on("Network.loadingFinished", self._finished)

    def _response(self, event) -> None:
        r = event["response"]
        self.responses[event["requestId"]] = {
            "url": r["url"], "status": r["status"], "type": event.get("type", ""),
            "cached": bool(r.get("fromDiskCache") or r.get("fromPrefetchCache") or r.get("fromServiceWorker")),
            "done": False}

    def _from_cache(self, event) -> None:
        self.responses.setdefault(event["requestId"], {"url": "", "status": 0, "done": False})["cached"] = True

    def _finished(self, event) -> None:
        if event["requestId"] in self.responses:
            self.responses[event["requestId"]]["done"] = True
            self.responses[event["requestId"]]["wire"] = event.get("encodedDataLength", 0)

    def start(self) -> None:
        self.responses = {}

    def summary(self, base: str) -> dict:
        files = []
        for request_id, r in sorted(self.responses.items(), key=lambda kv: kv[1]["url"]):
            if not r["url"].startswith(base):
                continue
            entry = {"path": r["url"][len(base):], "status": r["status"], "cached": r.get("cached", False),
                     "wire": r.get("wire", 0), "raw": 0, "gzip": 0}
            if r["status"] == 200 and not entry["cached"] and r["done"]:
                body = self.cdp.send("Network.getResponseBody", {"requestId": request_id})
                data = base64.b64decode(body["body"]) if body["base64Encoded"] else body["body"].encode("utf-8")
                if entry["wire"] >= len(data):  # the body came over the network (not a 304 revalidation)
                    entry["raw"] = len(data)
                    entry["gzip"] = len(gzip.compress(data, compresslevel=6, mtime=0))
                else:
                    entry["cached"] = True
            files.append(entry)
        return {"raw": sum(f["raw"] for f in files), "gzip": sum(f["gzip"] for f in files),
                "wire": sum(f["wire"] for f in files),
                "requests": len(files), "from_cache": sum(1 for f in files if f["cached"] or f["status"] == 304),
                "files": files}


def page_weight(browser, base: str, first: str, second: str) -> dict:
    """Bytes of a first visit to ``first``, then of ``second`` with the browser cache warm."""
    context = browser.new_context(service_workers="block")
    page = context.new_page()
    recorder = Recorder(page)
    page.goto(f"{base}/{first}", wait_until="networkidle")
    visit_one = recorder.summary(base + "/")
    recorder.start()
    page.goto(f"{base}/{second}", wait_until="networkidle")
    visit_two = recorder.summary(base + "/")
    context.close()
    return {"first": {"page": first, **visit_one}, "second": {"page": second, **visit_two}}


def throttled_page(browser, url: str):
    context = browser.new_context(service_workers="block")
    page = context.new_page()
    cdp = context.new_cdp_session(page)
    cdp.send("Emulation.setCPUThrottlingRate", {"rate": THROTTLE})
    page.goto(url, wait_until="networkidle")
    return context, page


def calculator_times(browser, base: str, names: list[str], rounds: int, reps: int = 1) -> dict:
    """Per calculator: the median over ``reps`` fresh pages of each page's median update time, and the
    floor timed on the same calculator's page, a fresh page per rep alternating with the calculator's
    (FLOOR_FORM: the same DOM to lay out, and a change of the machine's load moves both alike); and
    the same-writes floor (REPLAY_FORM: the texts and data-values one update writes, with no core and
    no glue), a third fresh page per rep."""
    out = {}
    for name in names:
        runs, floors, replays, field, error, replay_error = [], [], [], None, None, None
        url = f"{base}/calculators/{name}/index.html"
        for _ in range(max(1, reps)):
            context, page = throttled_page(browser, url)
            page.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
            page.evaluate(FLOOR_FORM)
            floor = page.evaluate(CALC_TIMER, {"name": "bench-floor", "rounds": rounds})
            context.close()
            context, page = throttled_page(browser, url)
            page.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
            result = page.evaluate(CALC_TIMER, {"name": name, "rounds": rounds})
            context.close()
            if "error" in result or "error" in floor:
                error = result.get("error") or floor.get("error")
                break
            field = result["field"]
            context, page = throttled_page(browser, url)
            page.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
            replay = page.evaluate(REPLAY_FORM, {"name": name, "field": field})
            if "error" not in replay:
                replay = page.evaluate(CALC_TIMER, {"name": "bench-replay", "rounds": rounds})
            context.close()
            runs.append(statistics.median(result["samples"]))
            floors.append(statistics.median(floor["samples"]))
            if "error" in replay:
                replay_error = replay["error"]
            else:
                replays.append(statistics.median(replay["samples"]))
        out[name] = {"error": error} if error else {"field": field, "median_ms": statistics.median(runs),
                                                     "runs_ms": runs, "floor_ms": statistics.median(floors),
                                                     "floor_runs_ms": floors,
                                                     "writes_ms": statistics.median(replays) if replays else None,
                                                     "writes_runs_ms": replays, "writes_error": replay_error}
    return out


# Runs in the page: set the bar fields (the page opens with a round size, so these are the first
# keystrokes that make a bar answer: how long each held the page is kept too), then change one field
# back and forth; per change, how long the keystroke's input handler held the page, the time until
# the AC result's data-value changes, and the longest task meanwhile (Long Tasks API: the solve
# itself, once typing has paused).
BAR_TIMER = """
async ({fields, edit, other, rounds}) => {
  const form = document.querySelector('form[data-calculator="skin-effect"]');
  if (!form) return {error: 'no skin-effect form'};
  const section = form.closest('section');
  const cell = section.querySelector('[data-result="ac_resistance"]') || section.querySelector('[data-result]');
  const set = (name, value) => {
    const input = form.querySelector(`[name="${name}"]`);
    input.value = value;
    input.dispatchEvent(new Event('input', {bubbles: true}));
  };
  const waitFor = (predicate, limit) => new Promise((resolve) => {
    const started = performance.now();
    const poll = () => {
      if (predicate()) resolve(performance.now());
      else if (performance.now() - started > limit) resolve(null);
      else setTimeout(poll, 5);
    };
    poll();
  });
  const firstHandlers = [];
  for (const [name, value] of Object.entries(fields)) {
    const start = performance.now();
    set(name, value);
    firstHandlers.push(performance.now() - start);
  }
  if (await waitFor(() => cell.dataset.value !== undefined && form.dataset.solving === undefined, 60000) === null)
    return {error: 'no AC result for ' + JSON.stringify(fields)};
  let longest = 0;
  const observer = new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) longest = Math.max(longest, entry.duration);
  });
  observer.observe({type: 'longtask'});
  const samples = [], blocks = [], handlers = [];
  let busyShown = false;
  const original = form.querySelector(`[name="${edit}"]`).value;
  for (let i = 0; i < rounds; i++) {
    const before = cell.dataset.value;
    longest = 0;
    const start = performance.now();
    set(edit, i % 2 === 0 ? other : original);
    handlers.push(performance.now() - start);
    const end = await waitFor(() => {
      if (form.dataset.solving !== undefined) busyShown = true;
      return cell.dataset.value !== undefined && cell.dataset.value !== before;
    }, 60000);
    if (end === null) return {error: 'the AC result did not change after ' + edit};
    await new Promise((resolve) => setTimeout(resolve, 50));  // let the observer report the last task
    samples.push(end - start);
    blocks.push(longest);
  }
  observer.disconnect();
  return {samples, blocks, handlers, firstHandlers, busyShown};
}
"""


def bar_solver_times(browser, base: str, cases: list[dict], reps: int) -> dict:
    """Per case: typing → AC result (median), the longest main-thread task meanwhile, whether the page
    said a solve was running."""
    out = {}
    for case in cases:
        context, page = throttled_page(browser, f"{base}/calculators/skin-effect/index.html")
        page.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
        result = page.evaluate(BAR_TIMER, {"fields": case["fields"], "edit": case["edit"], "other": case["other"],
                                           "rounds": max(3, reps)})
        context.close()
        if "error" in result:
            out[case["label"]] = {"error": result["error"]}
        else:
            out[case["label"]] = {"result_ms": statistics.median(result["samples"]), "runs_ms": result["samples"],
                                  "input_block_ms": max(result["blocks"]), "blocks_ms": result["blocks"],
                                  "handler_ms": max(result["handlers"] + result["firstHandlers"]),
                                  "handlers_ms": result["handlers"], "first_handlers_ms": result["firstHandlers"],
                                  "busy_shown": result["busyShown"]}
    return out


def search_times(browser, base: str, queries: list[str], rounds: int, reps: int = 1) -> dict:
    """Per query: the median over ``reps`` fresh pages of each page's median time."""
    runs: dict[str, list[float]] = {q: [] for q in queries}
    for _ in range(max(1, reps)):
        context, page = throttled_page(browser, f"{base}/index.html")
        page.wait_for_selector("html.search-ready", state="attached", timeout=60000)
        result = page.evaluate(SEARCH_TIMER, {"queries": queries, "rounds": rounds})
        context.close()
        if "error" in result:
            return {"error": result["error"]}
        for q, samples in result["samples"].items():
            runs[q].append(statistics.median(samples))
    per_query = {q: statistics.median(r) for q, r in runs.items()}
    return {"median_ms": statistics.median(per_query.values()), "worst_query_ms": max(per_query.values()),
            "per_query_ms": per_query, "runs_ms": runs}


# the first-contentful-paint entry, waited for: a throttled page may paint after its load event
FCP = """() => new Promise((resolve) => {
  const seen = (entries) => entries.find((e) => e.name === 'first-contentful-paint');
  const now = seen(performance.getEntriesByType('paint'));
  if (now) { resolve(now.startTime); return; }
  new PerformanceObserver((list) => { const e = seen(list.getEntries()); if (e) resolve(e.startTime); })
    .observe({type: 'paint', buffered: true});
  setTimeout(() => resolve(null), 15000);
})"""
SCRIPT_TAG = re.compile(r"<script\b[^>]*>.*?</script>", re.S | re.I)


def answer_with(html: str):
    """A route handler (Playwright calls it with the route and its request) that answers ``html``."""
    def answer(route, request=None) -> None:
        route.fulfill(body=html, content_type="text/html; charset=utf-8")
    return answer


def first_contentful_paint(browser, base: str, path: str, rounds: int) -> tuple[dict, dict]:
    """First contentful paint of ``path`` and of its floor: the same HTML with every <script> element
    removed, at the same address (so the same CSS and images load from the server). Both documents
    are answered from this process (Playwright's route), so both pay the same delivery; fresh
    context and ×4 throttling each time; page and floor alternate, so both see the same machine load."""
    url = f"{base}/{path}"
    import urllib.request
    with urllib.request.urlopen(url) as response:
        page_html = response.read().decode("utf-8")
    documents = {"page": page_html, "floor": SCRIPT_TAG.sub("", page_html)}
    samples = {"page": [], "floor": []}
    for _ in range(max(1, rounds)):
        for kind in ("page", "floor"):
            context = browser.new_context(service_workers="block")
            page = context.new_page()
            page.route(url, answer_with(documents[kind]))
            cdp = context.new_cdp_session(page)
            cdp.send("Emulation.setCPUThrottlingRate", {"rate": THROTTLE})
            page.goto(url, wait_until="load")
            fcp = page.evaluate(FCP)
            context.close()
            if fcp is not None:
                samples[kind].append(fcp)
    return tuple({"median_ms": statistics.median(s) if s else None, "samples_ms": s}
                 for s in (samples["page"], samples["floor"]))
