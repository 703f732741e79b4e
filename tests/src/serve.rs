//! A static file server on 127.0.0.1 for the built page, run on a background thread for the life
//! of a test. It can mount the folder under a sub-path to check the page works from one.

use std::path::{Component, Path, PathBuf};
use std::thread;

/// A running server; dropping it stops serving.
pub struct StaticServer {
    /// Base URL including the mount prefix, ending in `/`.
    pub url: String,
    server: std::sync::Arc<tiny_http::Server>,
    hits: std::sync::Arc<std::sync::atomic::AtomicUsize>,
    paths: std::sync::Arc<std::sync::Mutex<Vec<String>>>,
    handle: Option<thread::JoinHandle<()>>,
}

fn mime(path: &Path) -> &'static str {
    match path.extension().and_then(|e| e.to_str()).unwrap_or("") {
        "html" => "text/html; charset=utf-8",
        "js" => "text/javascript; charset=utf-8",
        "wasm" => "application/wasm",
        "css" => "text/css; charset=utf-8",
        "svg" => "image/svg+xml",
        "json" => "application/json",
        "webmanifest" => "application/manifest+json",
        "txt" => "text/plain; charset=utf-8",
        "png" => "image/png",
        _ => "application/octet-stream",
    }
}

impl StaticServer {
    /// Serves `root` at `http://127.0.0.1:<free port><prefix>` (prefix like `/` or `/tools/sc/`).
    ///
    /// # Errors
    /// When the port cannot be bound.
    pub fn start(root: &Path, prefix: &str) -> std::io::Result<Self> {
        Self::start_on(root, prefix, 0)
    }

    /// As [`start`](Self::start) on a given port (0 for any free one).
    ///
    /// # Errors
    /// When the port cannot be bound.
    pub fn start_on(root: &Path, prefix: &str, port: u16) -> std::io::Result<Self> {
        let server = tiny_http::Server::http(("127.0.0.1", port)).map_err(std::io::Error::other)?;
        let port = server.server_addr().to_ip().map(|a| a.port()).unwrap_or(0);
        let server = std::sync::Arc::new(server);
        let root = root.to_path_buf();
        let prefix = prefix.to_string();
        let s = server.clone();
        let p = prefix.clone();
        let hits = std::sync::Arc::new(std::sync::atomic::AtomicUsize::new(0));
        let counter = hits.clone();
        let paths = std::sync::Arc::new(std::sync::Mutex::new(Vec::new()));
        let seen = paths.clone();
        let handle = thread::spawn(move || {
            for req in s.incoming_requests() {
                counter.fetch_add(1, std::sync::atomic::Ordering::SeqCst);
                if let Ok(mut v) = seen.lock() {
                    v.push(req.url().to_string());
                }
                let url = req
                    .url()
                    .split(['?', '#'])
                    .next()
                    .unwrap_or("/")
                    .to_string();
                let resp = match resolve(&root, &p, &url) {
                    Some(file) => match std::fs::read(&file) {
                        Ok(bytes) => tiny_http::Response::from_data(bytes).with_header(
                            tiny_http::Header::from_bytes("Content-Type", mime(&file))
                                .expect("static header is valid"),
                        ),
                        Err(_) => tiny_http::Response::from_data(b"not found".to_vec())
                            .with_status_code(404),
                    },
                    None => {
                        tiny_http::Response::from_data(b"not found".to_vec()).with_status_code(404)
                    }
                };
                let _ = req.respond(resp);
            }
        });
        Ok(Self {
            url: format!("http://127.0.0.1:{port}{prefix}"),
            server,
            hits,
            paths,
            handle: Some(handle),
        })
    }
}

fn resolve(root: &Path, prefix: &str, url: &str) -> Option<PathBuf> {
    let rest = url
        .strip_prefix(prefix)
        .or_else(|| (url.to_string() + "/").strip_prefix(prefix).map(|_| ""))?;
    let rel = Path::new(rest);
    if rel.components().any(|c| !matches!(c, Component::Normal(_))) {
        return None;
    }
    let mut path = root.join(rel);
    if path.is_dir() {
        path = path.join("index.html");
    }
    path.is_file().then_some(path)
}

impl StaticServer {
    /// The paths requested so far, in order.
    #[must_use]
    pub fn paths(&self) -> Vec<String> {
        self.paths.lock().map(|v| v.clone()).unwrap_or_default()
    }

    /// How many requests the server has received.
    #[must_use]
    pub fn hits(&self) -> usize {
        self.hits.load(std::sync::atomic::Ordering::SeqCst)
    }
}

impl Drop for StaticServer {
    fn drop(&mut self) {
        self.server.unblock();
        if let Some(h) = self.handle.take() {
            let _ = h.join();
        }
    }
}
