//! What the browser tests share: opening the built page (served, under a sub-path, or from
//! disk), reading its results, checking drawn circles, console errors and screenshots.

use crate::browser::Chromium;
use crate::check::{close, target_dir};
use crate::serve::StaticServer;
use serde_json::Value;
use std::path::PathBuf;
use std::time::Duration;

/// How long a page may take to show a result.
pub const WAIT: Duration = Duration::from_secs(20);

/// Another build to measure beside this one: `$STRESSCASE_DIST_BASE`, if set.
#[must_use]
pub fn base_dist() -> Option<PathBuf> {
    std::env::var_os("STRESSCASE_DIST_BASE").map(PathBuf::from)
}

/// The built (packed) folder: `$STRESSCASE_DIST`, else `dist/`.
#[must_use]
pub fn dist() -> PathBuf {
    let d = std::env::var_os("STRESSCASE_DIST").map_or_else(
        || PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../dist"),
        PathBuf::from,
    );
    assert!(
        d.join("index.html").is_file(),
        "no built page at {} — run `cargo xtask test`",
        d.display()
    );
    d
}

/// A page under test: a browser and, when served, the server.
pub struct Page {
    /// The browser.
    pub b: Chromium,
    server: Option<StaticServer>,
}

impl Page {
    /// Serves the built folder at `/` and opens it in a fresh browser.
    #[must_use]
    pub fn open() -> Self {
        Self::open_at("/", "")
    }

    /// Serves the built folder under `prefix` and opens it with `fragment` (e.g. `#v=1&…`).
    #[must_use]
    pub fn open_at(prefix: &str, fragment: &str) -> Self {
        let server = StaticServer::start(&dist(), prefix).expect("serve dist");
        let b = Chromium::launch().expect("launch chromium");
        let url = format!("{}{fragment}", server.url);
        let mut p = Self {
            b,
            server: Some(server),
        };
        p.go(&url);
        p
    }

    /// Opens `url` in a given browser (no server of ours).
    #[must_use]
    pub fn with_browser(b: Chromium, url: &str) -> Self {
        let mut p = Self { b, server: None };
        p.go(url);
        p
    }

    /// Navigates and waits until the page shows a result.
    pub fn go(&mut self, url: &str) {
        self.b.goto(url).expect("open page");
        self.wait_ready();
    }

    /// Waits until the page shows a result.
    pub fn wait_ready(&mut self) {
        self.b
            .wait_for(
                "document.querySelector('td[data-key=\"sigma1\"]') !== null",
                WAIT,
            )
            .expect("page computes");
    }

    /// The server's base URL (with prefix).
    #[must_use]
    pub fn base_url(&self) -> String {
        self.server
            .as_ref()
            .map(|s| s.url.clone())
            .unwrap_or_default()
    }

    /// Paths our server was asked for so far.
    #[must_use]
    pub fn server_paths(&self) -> Vec<String> {
        self.server
            .as_ref()
            .map(StaticServer::paths)
            .unwrap_or_default()
    }

    /// Requests our server has answered so far.
    #[must_use]
    pub fn server_hits(&self) -> usize {
        self.server.as_ref().map_or(0, StaticServer::hits)
    }

    /// The unrounded value of result `key`.
    pub fn value(&mut self, key: &str) -> f64 {
        let v = self
            .b
            .eval(&format!(
                "document.querySelector('td[data-key=\"{key}\"]')?.dataset.value ?? null"
            ))
            .expect("read value");
        v.as_str()
            .and_then(|s| s.parse().ok())
            .unwrap_or_else(|| panic!("no numeric value for {key}: {v}"))
    }

    /// The case link in the address bar (`location.hash`), once the page has written the case on
    /// screen there: it waits for typing to pause, so this waits until the address bar holds
    /// the link the calc sheet prints.
    pub fn link(&mut self) -> String {
        let settled =
            "(() => { const s = document.getElementById('sheet-link')?.textContent ?? ''; \
                       return location.hash.length > 1 && s.endsWith(location.hash); })()";
        if let Err(e) = self.b.wait_for(settled, WAIT) {
            panic!("the address bar never held the case on screen: {e}");
        }
        self.text("location.hash")
    }

    /// A string evaluated in the page.
    pub fn text(&mut self, js: &str) -> String {
        self.b
            .eval(js)
            .expect("eval")
            .as_str()
            .unwrap_or_default()
            .to_string()
    }

    /// Waits until the result `key` shows `want` (relative 1e-9), then returns it.
    pub fn wait_value(&mut self, key: &str, want: f64) -> f64 {
        let js = format!(
            "(() => {{ const v = +document.querySelector('td[data-key=\"{key}\"]')?.dataset.value; return Math.abs(v - ({want:e})) <= 1e-9 * Math.max(1, Math.abs({want:e})); }})()"
        );
        if let Err(e) = self.b.wait_for(&js, WAIT) {
            let got = self.value(key);
            panic!("{key}: page shows {got:e}, core says {want:e}: {e}");
        }
        self.value(key)
    }

    /// Picks `value` in the drop-down `#id`, as a user's choice does (a `change` event).
    pub fn choose(&mut self, id: &str, value: &str) {
        let ok = self
            .b
            .eval(&format!(
                "(() => {{ const s = document.getElementById({id:?}); if (!s) return false; s.value = {value:?}; if (s.value !== {value:?}) return false; s.dispatchEvent(new Event('change', {{ bubbles: true }})); return true; }})()"
            ))
            .expect("choose");
        assert_eq!(ok, Value::Bool(true), "no option {value:?} in #{id}");
    }

    /// Waits until the element `#id` exists.
    pub fn wait_for_id(&mut self, id: &str) {
        self.b
            .wait_for(&format!("document.getElementById({id:?}) !== null"), WAIT)
            .unwrap_or_else(|e| panic!("#{id} never appeared: {e}"));
    }

    /// Waits until `js` (a number expression) reads `want` (relative 1e-9), then returns it.
    pub fn wait_number(&mut self, what: &str, js: &str, want: f64) -> f64 {
        let check = format!(
            "(() => {{ const v = +({js}); return Math.abs(v - ({want:e})) <= 1e-9 * Math.max(1, Math.abs({want:e})); }})()"
        );
        if let Err(e) = self.b.wait_for(&check, WAIT) {
            let got = self.b.eval(js).unwrap_or_default();
            panic!("{what}: page shows {got}, core says {want:e}: {e}");
        }
        self.b
            .eval(js)
            .ok()
            .and_then(|v| v.as_f64())
            .unwrap_or(f64::NAN)
    }

    /// (ox, oy, k, cx, cy, r) of the drawn circle `role`.
    pub fn circle(&mut self, role: &str) -> (f64, f64, f64, f64, f64, f64) {
        let v: Value = self
            .b
            .eval(&format!(
                "(() => {{ const s = document.getElementById('mohr-svg'); const c = s.querySelector('circle[data-role=\"{role}\"]'); \
                 return [+s.dataset.originX, +s.dataset.originY, +s.dataset.pxPerUnit, +c.getAttribute('cx'), +c.getAttribute('cy'), +c.getAttribute('r')]; }})()"
            ))
            .expect("read circle");
        let f = |i: usize| v[i].as_f64().unwrap_or(f64::NAN);
        (f(0), f(1), f(2), f(3), f(4), f(5))
    }

    /// Checks the drawn circle `role` has core's centre and radius (in the page's unit).
    pub fn check_circle(&mut self, role: &str, centre: f64, radius: f64) {
        let (ox, oy, k, cx, cy, r) = self.circle(role);
        let px_tol = 1e-6 * (1.0 + cx.abs());
        close(role, "centre (from cx)", (cx - ox) / k, centre, px_tol / k);
        close(role, "radius (from r)", r / k, radius, px_tol / k);
        close(role, "cy on the σ axis", cy, oy, 1e-9);
        assert!(
            cx - r >= 0.0 && cx + r <= 720.0,
            "{role} leaves the drawing: cx {cx}, r {r}"
        );
    }

    /// The serious and critical accessibility violations axe-core finds in the page as it is
    /// now (axe-core from npm, installed by `cargo xtask test` into `target/npm`).
    pub fn axe_violations(&mut self) -> Vec<String> {
        let path = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
            .join("../target/npm/node_modules/axe-core/axe.min.js");
        let axe = std::fs::read_to_string(&path).unwrap_or_else(|e| {
            panic!(
                "{}: {e} — `cargo xtask test` installs axe-core from npm",
                path.display()
            )
        });
        self.b.eval(&axe).unwrap();
        let v: Value = self
            .b
            .eval(
                "axe.run(document, { resultTypes: ['violations'] }).then(r => r.violations.filter(v => v.impact === 'serious' || v.impact === 'critical').map(v => v.id + ' (' + v.impact + '): ' + v.help + ' — ' + v.nodes.slice(0, 4).map(n => n.target.join(' ')).join(' | ')))",
            )
            .unwrap();
        v.as_array()
            .unwrap()
            .iter()
            .map(|x| x.as_str().unwrap_or_default().to_string())
            .collect()
    }

    /// Fails on any console error so far.
    pub fn no_console_errors(&mut self) {
        let errs = self.b.console_errors().expect("console");
        assert!(errs.is_empty(), "console errors: {errs:#?}");
    }

    /// Saves `target/browser/<name>.png`.
    pub fn shot(&mut self, name: &str) {
        let path = target_dir().join("browser").join(format!("{name}.png"));
        self.b.screenshot(&path).expect("screenshot");
    }

    /// Keeps every Blob the page makes a URL for, and lets downloads go to `dir`: headless
    /// Chromium offline does not finish downloads, so [`Page::downloaded`] reads the Blob.
    pub fn capture_downloads(&mut self, dir: &std::path::Path) {
        self.b
            .add_init_script(
                "const keep = URL.createObjectURL; URL.createObjectURL = function (b) { const u = keep.call(URL, b); (window.__blobs = window.__blobs || {})[u] = b; return u; };",
            )
            .expect("init script");
        self.b.reload().expect("reload");
        self.wait_ready();
        self.b.allow_downloads(dir).expect("downloads");
    }

    /// The bytes of the last download offered as `name` (after [`Page::capture_downloads`]).
    pub fn downloaded(&mut self, name: &str) -> Vec<u8> {
        use base64::Engine as _;
        let start = std::time::Instant::now();
        loop {
            self.b.eval("0").expect("eval"); // reads the events that arrived
            let begun = self.b.events_named("Page.downloadWillBegin");
            if let Some(i) = begun.iter().rposition(|e| e["suggestedFilename"] == name) {
                let url = begun[i]["url"].as_str().unwrap_or_default().to_string();
                // Read in slices: one DevTools message holds at most 16 MiB.
                let len = self
                    .b
                    .eval(&format!(
                        "(async () => {{ const b = (window.__blobs || {{}})[{url:?}]; if (!b) return 0; window.__dl = await new Promise(r => {{ const f = new FileReader(); f.onload = () => r(f.result); f.readAsDataURL(b); }}); return window.__dl.length; }})()"
                    ))
                    .expect("read blob")
                    .as_u64()
                    .unwrap_or(0);
                let mut data = String::new();
                let step = 4_000_000;
                for at in (0..len).step_by(step) {
                    data.push_str(
                        &self.text(&format!("window.__dl.slice({at}, {})", at + step as u64)),
                    );
                }
                let b64 = data.split_once(',').map(|(_, d)| d).unwrap_or_default();
                return base64::engine::general_purpose::STANDARD
                    .decode(b64)
                    .unwrap_or_else(|e| panic!("{name}: {e}"));
            }
            assert!(
                start.elapsed() < Duration::from_secs(20),
                "{name} was never offered as a download"
            );
            std::thread::sleep(Duration::from_millis(100));
        }
    }
}
