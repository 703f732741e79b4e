//! A small driver for Debian's headless Chromium over the DevTools protocol (a websocket). It
//! launches a fresh browser with its own profile, opens one page, and offers what the page tests
//! need: navigate, evaluate JavaScript, type like a user, click, read console errors and the
//! request log, take screenshots. No browser is downloaded; `CHROMIUM` overrides the binary path.

use serde_json::{json, Value};
use std::collections::VecDeque;
use std::net::TcpStream;
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};
use tungstenite::stream::MaybeTlsStream;
use tungstenite::{Message, WebSocket};

/// Errors from the driver, as text (tests print them).
pub type Result<T> = std::result::Result<T, String>;

/// A running Chromium with one attached page.
pub struct Chromium {
    child: Child,
    profile: PathBuf,
    keep_profile: bool,
    ws: WebSocket<MaybeTlsStream<TcpStream>>,
    session: String,
    next_id: u64,
    events: VecDeque<Value>,
    console_errors: Vec<String>,
    requests: Vec<String>,
    service_worker_responses: Vec<String>,
}

/// A new, unused profile folder under `target/browser-profiles/`.
#[must_use]
pub fn fresh_profile() -> PathBuf {
    static COUNT: std::sync::atomic::AtomicUsize = std::sync::atomic::AtomicUsize::new(0);
    let n = COUNT.fetch_add(1, std::sync::atomic::Ordering::SeqCst);
    crate::check::target_dir().join(format!("browser-profiles/p{}-{n}", std::process::id()))
}

/// The Chromium binary: `$CHROMIUM`, else the Debian path.
#[must_use]
pub fn chromium_path() -> PathBuf {
    std::env::var_os("CHROMIUM").map_or_else(|| PathBuf::from("/usr/bin/chromium"), PathBuf::from)
}

impl Chromium {
    /// Starts a headless Chromium with a fresh profile under `target/` and attaches to a blank page.
    ///
    /// # Errors
    /// When the browser is missing, does not start, or does not answer within 30 s.
    pub fn launch() -> Result<Self> {
        let profile = fresh_profile();
        let _ = std::fs::remove_dir_all(&profile);
        Self::launch_with_profile(profile, false)
    }

    /// Starts Chromium on an existing profile folder (to test what survives a browser restart).
    /// With `keep`, the folder is left in place when the browser is dropped.
    ///
    /// # Errors
    /// As [`launch`](Self::launch).
    pub fn launch_with_profile(profile: PathBuf, keep: bool) -> Result<Self> {
        std::fs::create_dir_all(&profile).map_err(|e| format!("profile dir: {e}"))?;
        let _ = std::fs::remove_file(profile.join("DevToolsActivePort"));
        let bin = chromium_path();
        let child = Command::new(&bin)
            .args([
                "--headless",
                "--no-sandbox",
                "--disable-gpu",
                "--disable-quic",
                "--no-first-run",
                "--disable-background-networking",
                "--disable-component-update",
                "--disable-sync",
                "--disable-extensions",
                "--disable-default-apps",
                "--mute-audio",
                "--hide-scrollbars",
                "--window-size=1400,1600",
                "--remote-debugging-port=0",
                "--remote-allow-origins=*",
            ])
            .arg(format!("--user-data-dir={}", profile.display()))
            .arg("about:blank")
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .map_err(|e| {
                format!(
                    "cannot start {}: {e} (install Debian's chromium)",
                    bin.display()
                )
            })?;
        let port_file = profile.join("DevToolsActivePort");
        let start = Instant::now();
        let (port, path) = loop {
            if let Ok(text) = std::fs::read_to_string(&port_file) {
                let mut lines = text.lines();
                if let (Some(p), Some(path)) = (lines.next(), lines.next()) {
                    break (p.trim().to_string(), path.trim().to_string());
                }
            }
            if start.elapsed() > Duration::from_secs(30) {
                return Err("Chromium did not open its DevTools port within 30 s".into());
            }
            std::thread::sleep(Duration::from_millis(50));
        };
        let (ws, _) = tungstenite::connect(format!("ws://127.0.0.1:{port}{path}"))
            .map_err(|e| format!("devtools connect: {e}"))?;
        if let MaybeTlsStream::Plain(s) = ws.get_ref() {
            s.set_read_timeout(Some(Duration::from_secs(60)))
                .map_err(|e| e.to_string())?;
        }
        let mut me = Self {
            child,
            keep_profile: keep,
            profile,
            ws,
            session: String::new(),
            next_id: 1,
            events: VecDeque::new(),
            console_errors: Vec::new(),
            requests: Vec::new(),
            service_worker_responses: Vec::new(),
        };
        let target = me.browser_call("Target.createTarget", json!({ "url": "about:blank" }))?;
        let target_id = target["targetId"]
            .as_str()
            .ok_or("no targetId")?
            .to_string();
        let attached = me.browser_call(
            "Target.attachToTarget",
            json!({ "targetId": target_id, "flatten": true }),
        )?;
        me.session = attached["sessionId"]
            .as_str()
            .ok_or("no sessionId")?
            .to_string();
        for domain in [
            "Page.enable",
            "Runtime.enable",
            "Network.enable",
            "Log.enable",
        ] {
            me.call(domain, json!({}))?;
        }
        Ok(me)
    }

    fn send(&mut self, method: &str, params: Value, session: Option<&str>) -> Result<Value> {
        let id = self.next_id;
        self.next_id += 1;
        let mut msg = json!({ "id": id, "method": method, "params": params });
        if let Some(s) = session {
            msg["sessionId"] = json!(s);
        }
        self.ws
            .send(Message::text(msg.to_string()))
            .map_err(|e| format!("{method}: send: {e}"))?;
        loop {
            let m = self.ws.read().map_err(|e| format!("{method}: read: {e}"))?;
            let Message::Text(text) = m else { continue };
            let v: Value =
                serde_json::from_str(text.as_str()).map_err(|e| format!("bad json: {e}"))?;
            if v["id"].as_u64() == Some(id) {
                if let Some(err) = v.get("error") {
                    return Err(format!("{method}: {err}"));
                }
                return Ok(v["result"].clone());
            }
            self.note_event(v);
        }
    }

    fn note_event(&mut self, v: Value) {
        match v["method"].as_str().unwrap_or("") {
            "Runtime.consoleAPICalled"
                if matches!(v["params"]["type"].as_str(), Some("error" | "assert")) =>
            {
                let args = v["params"]["args"].as_array().cloned().unwrap_or_default();
                let text: Vec<String> = args
                    .iter()
                    .map(|a| {
                        a["value"]
                            .as_str()
                            .map_or_else(|| a["description"].to_string(), str::to_string)
                    })
                    .collect();
                self.console_errors
                    .push(format!("console.error: {}", text.join(" ")));
            }
            "Runtime.exceptionThrown" => {
                let d = &v["params"]["exceptionDetails"];
                self.console_errors.push(format!(
                    "exception: {} {}",
                    d["text"], d["exception"]["description"]
                ));
            }
            "Log.entryAdded" if v["params"]["entry"]["level"].as_str() == Some("error") => {
                let e = &v["params"]["entry"];
                self.console_errors
                    .push(format!("log: {} {}", e["text"], e["url"]));
            }
            "Network.responseReceived"
                if v["params"]["response"]["fromServiceWorker"] == json!(true) =>
            {
                if let Some(u) = v["params"]["response"]["url"].as_str() {
                    self.service_worker_responses.push(u.to_string());
                }
            }
            "Network.requestWillBeSent" => {
                if let Some(u) = v["params"]["request"]["url"].as_str() {
                    self.requests.push(u.to_string());
                }
            }
            _ => {}
        }
        self.events.push_back(v);
        if self.events.len() > 2000 {
            self.events.pop_front();
        }
    }

    fn browser_call(&mut self, method: &str, params: Value) -> Result<Value> {
        self.send(method, params, None)
    }

    /// A DevTools command on the page.
    ///
    /// # Errors
    /// The protocol's error, or a transport failure.
    pub fn call(&mut self, method: &str, params: Value) -> Result<Value> {
        let s = self.session.clone();
        self.send(method, params, Some(&s))
    }

    /// Evaluates JavaScript in the page and returns its value (promises are awaited).
    ///
    /// # Errors
    /// When the script throws.
    pub fn eval(&mut self, js: &str) -> Result<Value> {
        let r = self.call(
            "Runtime.evaluate",
            json!({ "expression": js, "returnByValue": true, "awaitPromise": true }),
        )?;
        if let Some(ex) = r.get("exceptionDetails") {
            return Err(format!(
                "script failed: {} — {}",
                ex["exception"]["description"], js
            ));
        }
        Ok(r["result"]["value"].clone())
    }

    /// Polls `js` until it is truthy.
    ///
    /// # Errors
    /// After `timeout` with the last value seen.
    pub fn wait_for(&mut self, js: &str, timeout: Duration) -> Result<Value> {
        let start = Instant::now();
        loop {
            let v = self.eval(js)?;
            let truthy = match &v {
                Value::Null => false,
                Value::Bool(b) => *b,
                Value::String(s) => !s.is_empty(),
                Value::Number(n) => n.as_f64() != Some(0.0),
                _ => true,
            };
            if truthy {
                return Ok(v);
            }
            if start.elapsed() > timeout {
                return Err(format!(
                    "timed out after {timeout:?} waiting for: {js} (last: {v})"
                ));
            }
            std::thread::sleep(Duration::from_millis(40));
        }
    }

    /// Opens `url` and waits for the document to finish loading.
    ///
    /// # Errors
    /// On navigation failure or a load timeout.
    pub fn goto(&mut self, url: &str) -> Result<()> {
        let r = self.call("Page.navigate", json!({ "url": url }))?;
        if let Some(e) = r.get("errorText").and_then(Value::as_str) {
            return Err(format!("navigate {url}: {e}"));
        }
        self.wait_for(
            "document.readyState === 'complete'",
            Duration::from_secs(30),
        )?;
        Ok(())
    }

    /// Replaces the text of the input `#id` as a user would: focus, select all, type.
    ///
    /// # Errors
    /// When the element is missing.
    pub fn type_into(&mut self, id: &str, text: &str) -> Result<()> {
        let found = self.eval(&format!(
            "(() => {{ const e = document.getElementById({id:?}); if (!e) return false; e.focus(); e.select(); return true; }})()"
        ))?;
        if found != Value::Bool(true) {
            return Err(format!("no input #{id}"));
        }
        if text.is_empty() {
            for kind in ["keyDown", "keyUp"] {
                self.call(
                    "Input.dispatchKeyEvent",
                    json!({ "type": kind, "key": "Backspace", "code": "Backspace", "windowsVirtualKeyCode": 8 }),
                )?;
            }
        } else {
            self.call("Input.insertText", json!({ "text": text }))?;
        }
        Ok(())
    }

    /// Clicks the element `#id` at its centre with a real mouse event.
    ///
    /// # Errors
    /// When the element is missing or has no box.
    pub fn click(&mut self, id: &str) -> Result<()> {
        let r = self.eval(&format!(
            "(() => {{ const e = document.getElementById({id:?}); if (!e) return null; e.scrollIntoView({{block: 'center'}}); const b = e.getBoundingClientRect(); return [b.x + b.width / 2, b.y + b.height / 2]; }})()"
        ))?;
        let (Some(x), Some(y)) = (r[0].as_f64(), r[1].as_f64()) else {
            return Err(format!("no element #{id} to click"));
        };
        for kind in ["mousePressed", "mouseReleased"] {
            self.call(
                "Input.dispatchMouseEvent",
                json!({ "type": kind, "x": x, "y": y, "button": "left", "clickCount": 1 }),
            )?;
        }
        Ok(())
    }

    /// Reloads the page and waits for it to load.
    ///
    /// # Errors
    /// On protocol failure or a load timeout.
    pub fn reload(&mut self) -> Result<()> {
        self.call("Page.reload", json!({ "ignoreCache": false }))?;
        std::thread::sleep(Duration::from_millis(200));
        self.wait_for(
            "document.readyState === 'complete'",
            Duration::from_secs(30),
        )
        .map(|_| ())
    }

    /// Runs `js` in every new document before the page's own scripts.
    ///
    /// # Errors
    /// On protocol failure.
    pub fn add_init_script(&mut self, js: &str) -> Result<()> {
        self.call(
            "Page.addScriptToEvaluateOnNewDocument",
            json!({ "source": js }),
        )
        .map(|_| ())
    }

    /// Cuts (or restores) the network, as DevTools' offline mode does, for the page and for
    /// every service worker running (a worker's fetches do not pass through the page).
    ///
    /// # Errors
    /// On protocol failure.
    pub fn set_offline(&mut self, offline: bool) -> Result<()> {
        let conditions = json!({ "offline": offline, "latency": 0, "downloadThroughput": -1, "uploadThroughput": -1 });
        self.call("Network.emulateNetworkConditions", conditions.clone())?;
        // Since Chromium 138 the call above cuts requests but leaves `navigator.onLine` alone;
        // this sets it (older builds lack the method and set it above).
        let _ = self.call("Network.overrideNetworkState", conditions.clone());
        let targets = self.browser_call("Target.getTargets", json!({}))?;
        let workers: Vec<String> = targets["targetInfos"]
            .as_array()
            .into_iter()
            .flatten()
            .filter(|t| t["type"] == "service_worker")
            .filter_map(|t| t["targetId"].as_str().map(str::to_string))
            .collect();
        for id in workers {
            let attached = self.browser_call(
                "Target.attachToTarget",
                json!({ "targetId": id, "flatten": true }),
            )?;
            let session = attached["sessionId"]
                .as_str()
                .ok_or("no worker session")?
                .to_string();
            self.send("Network.enable", json!({}), Some(&session))?;
            self.send(
                "Network.emulateNetworkConditions",
                conditions.clone(),
                Some(&session),
            )?;
        }
        Ok(())
    }

    /// The DevTools events named `method` seen so far (kept: the last 2000 events).
    #[must_use]
    pub fn events_named(&self, method: &str) -> Vec<Value> {
        self.events
            .iter()
            .filter(|e| e["method"] == method)
            .map(|e| e["params"].clone())
            .collect()
    }

    /// Saves downloads into `dir` without asking.
    ///
    /// # Errors
    /// On protocol failure.
    pub fn allow_downloads(&mut self, dir: &Path) -> Result<()> {
        std::fs::create_dir_all(dir).map_err(|e| e.to_string())?;
        self.browser_call(
            "Browser.setDownloadBehavior",
            json!({ "behavior": "allow", "downloadPath": dir.to_string_lossy(), "eventsEnabled": true }),
        )
        .map(|_| ())
    }

    /// Emulates a screen of `width` × `height` CSS pixels (a phone when `mobile`).
    ///
    /// # Errors
    /// On protocol failure.
    pub fn set_viewport(&mut self, width: u32, height: u32, mobile: bool) -> Result<()> {
        self.call(
            "Emulation.setDeviceMetricsOverride",
            json!({ "width": width, "height": height, "deviceScaleFactor": 1, "mobile": mobile }),
        )
        .map(|_| ())
    }

    /// Lets scripts injected by the test run despite the page's Content-Security-Policy (for
    /// accessibility rules injected into the page). Takes effect on the next navigation.
    ///
    /// # Errors
    /// On protocol failure.
    pub fn bypass_csp(&mut self) -> Result<()> {
        self.call("Page.setBypassCSP", json!({ "enabled": true }))
            .map(|_| ())
    }

    /// Prints the page to PDF as the browser's "Save as PDF" does, on paper of `width` ×
    /// `height` inches, and writes it to `path`.
    ///
    /// # Errors
    /// On protocol or file failure.
    pub fn print_pdf(&mut self, path: &Path, width: f64, height: f64) -> Result<()> {
        let r = self.call(
            "Page.printToPDF",
            json!({ "paperWidth": width, "paperHeight": height, "printBackground": true,
                    "marginTop": 0, "marginBottom": 0, "marginLeft": 0, "marginRight": 0,
                    "preferCSSPageSize": false }),
        )?;
        write_base64(path, r["data"].as_str().ok_or("no PDF data")?)
    }

    /// A screenshot of what is on screen (the viewport only).
    ///
    /// # Errors
    /// On protocol or file failure.
    pub fn screenshot_viewport(&mut self, path: &Path) -> Result<()> {
        let r = self.call("Page.captureScreenshot", json!({ "format": "png" }))?;
        write_base64(path, r["data"].as_str().ok_or("no screenshot data")?)
    }

    /// Grants clipboard access to the page.
    ///
    /// # Errors
    /// On protocol failure.
    pub fn grant_clipboard(&mut self) -> Result<()> {
        self.browser_call(
            "Browser.grantPermissions",
            json!({ "permissions": ["clipboardReadWrite", "clipboardSanitizedWrite"] }),
        )
        .map(|_| ())
    }

    /// Chooses `file` in the file input `#id`, as a user picking it would, and fires `change`.
    ///
    /// # Errors
    /// When the input is missing.
    pub fn choose_file(&mut self, id: &str, file: &Path) -> Result<()> {
        let doc = self.call("DOM.getDocument", json!({ "depth": 0 }))?;
        let root = doc["root"]["nodeId"].as_i64().ok_or("no document node")?;
        let found = self.call(
            "DOM.querySelector",
            json!({ "nodeId": root, "selector": format!("#{id}") }),
        )?;
        let node = found["nodeId"]
            .as_i64()
            .filter(|&n| n != 0)
            .ok_or_else(|| format!("no #{id}"))?;
        let file = file
            .canonicalize()
            .map_err(|e| format!("{}: {e}", file.display()))?;
        self.call(
            "DOM.setFileInputFiles",
            json!({ "nodeId": node, "files": [file.to_string_lossy()] }),
        )?;
        Ok(())
    }

    /// Console errors, uncaught exceptions and error log entries seen so far.
    ///
    /// # Errors
    /// On a transport failure while flushing pending events.
    pub fn console_errors(&mut self) -> Result<Vec<String>> {
        self.eval("0")?;
        Ok(self.console_errors.clone())
    }

    /// URLs whose responses the page got from its service worker.
    #[must_use]
    pub fn service_worker_responses(&self) -> &[String] {
        &self.service_worker_responses
    }

    /// Every URL the page requested so far.
    #[must_use]
    pub fn requests(&self) -> &[String] {
        &self.requests
    }

    /// Saves a PNG screenshot of the whole page.
    ///
    /// # Errors
    /// On protocol or file errors.
    pub fn screenshot(&mut self, path: &Path) -> Result<()> {
        let r = self.call(
            "Page.captureScreenshot",
            json!({ "format": "png", "captureBeyondViewport": true }),
        )?;
        write_base64(path, r["data"].as_str().ok_or("no screenshot data")?)
    }
}

/// Writes DevTools' base64 `data` to `path`, making its folder.
fn write_base64(path: &Path, data: &str) -> Result<()> {
    use base64::Engine as _;
    let bytes = base64::engine::general_purpose::STANDARD
        .decode(data)
        .map_err(|e| e.to_string())?;
    if let Some(dir) = path.parent() {
        std::fs::create_dir_all(dir).map_err(|e| e.to_string())?;
    }
    std::fs::write(path, bytes).map_err(|e| format!("{}: {e}", path.display()))
}

impl Drop for Chromium {
    fn drop(&mut self) {
        // Close like a user would, so the profile (local storage included) is written to disk;
        // kill only if it does not exit within 10 s.
        let _ = self.browser_call("Browser.close", json!({}));
        let start = Instant::now();
        while start.elapsed() < Duration::from_secs(10) {
            if matches!(self.child.try_wait(), Ok(Some(_))) {
                break;
            }
            std::thread::sleep(Duration::from_millis(50));
        }
        let _ = self.child.kill();
        let _ = self.child.wait();
        if !self.keep_profile {
            let _ = std::fs::remove_dir_all(&self.profile);
        }
    }
}
