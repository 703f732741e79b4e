//! Packs trunk's output into the folder users get: one self-contained `index.html` that works
//! opened from disk (file://) and served from any path, plus a service worker and a manifest so
//! that an http visit keeps working offline.
//!
//! Browsers block module imports and `fetch` on file://, so the JS glue is inlined into a module
//! script and the wasm bytes are embedded (gzipped, then base64), inflated by the browser's
//! `DecompressionStream` and started with `initSync`. The stylesheet and
//! the icon are inlined too. A Content-Security-Policy meta tag allows exactly the inline script
//! and style (by their sha256 hashes) and wasm compilation; nothing else runs, and no other origin
//! is ever contacted.

use base64::engine::general_purpose::STANDARD as B64;
use base64::Engine as _;
use sha2::{Digest, Sha256};
use std::fs;
use std::io::Write as _;
use std::path::Path;

/// Files of trunk's output that the packer reads, found from its index.html.
#[derive(Debug, PartialEq, Eq)]
pub struct TrunkFiles {
    /// The wasm-bindgen JS glue.
    pub js: String,
    /// The wasm module.
    pub wasm: String,
    /// The stylesheet.
    pub css: String,
    /// The page's static masthead (`<header class="masthead">…</header>` in web/index.html),
    /// put before the script so it is painted while the rest of the page arrives.
    pub masthead: String,
}

fn attr_after<'a>(html: &'a str, marker: &str, end: char) -> Option<&'a str> {
    let start = html.find(marker)? + marker.len();
    let rest = &html[start..];
    Some(&rest[..rest.find(end)?])
}

/// Finds the glue, wasm and stylesheet names in trunk's index.html.
///
/// # Errors
/// When one is missing (trunk changed its output).
pub fn trunk_files(index: &str) -> Result<TrunkFiles, String> {
    let find = |marker: &str, end: char, what: &str| {
        attr_after(index, marker, end)
            .map(|s| s.trim_start_matches("./").to_string())
            .ok_or_else(|| format!("trunk's index.html has no {what} (looked for {marker:?})"))
    };
    Ok(TrunkFiles {
        js: find("from '", '\'', "JS glue import")?,
        wasm: find("module_or_path: '", '\'', "wasm path")?,
        css: find("rel=\"stylesheet\" href=\"", '"', "stylesheet")?,
        masthead: index
            .find("<header class=\"masthead\">")
            .and_then(|a| Some(&index[a..a + index[a..].find("</header>")? + "</header>".len()]))
            .map(str::to_string)
            .ok_or("trunk's index.html has no <header class=\"masthead\"> (see web/index.html)")?,
    })
}

/// The wasm module as embedded: gzip (zopfli, 15 iterations), so the page is about half the size
/// on the wire and on disk; the page inflates it with the browser's `DecompressionStream`.
///
/// # Panics
/// Never in practice: zopfli writes to a `Vec`, which cannot fail.
#[must_use]
pub fn packed_wasm(wasm: &[u8]) -> Vec<u8> {
    let mut out = Vec::with_capacity(wasm.len() / 2);
    zopfli::compress(
        zopfli::Options::default(),
        zopfli::Format::Gzip,
        wasm,
        &mut out,
    )
    .expect("writing to a Vec");
    out
}

/// Removes the glue's `export` keywords' need for a loader: the glue stays a module (exports in
/// an inline module are allowed), and the start-up code is appended after it: the embedded
/// wasm is decoded from base64 (by `Uint8Array.fromBase64` where the browser has it), inflated
/// (gzip) by `DecompressionStream` and started with `initSync`. A browser without `DecompressionStream` is told so on the page.
fn boot_script(glue: &str, wasm: &[u8]) -> String {
    format!(
        "{glue}\n;(async () => {{\n  try {{\n    const b64 = \"{b64}\";\n    // The browser's own decoder where it has one (Chromium 140, Firefox 133, Safari 18.2).\n    const packed = Uint8Array.fromBase64 ? Uint8Array.fromBase64(b64) : (() => {{\n      const text = atob(b64);\n      const a = new Uint8Array(text.length);\n      for (let i = 0; i < text.length; i++) a[i] = text.charCodeAt(i);\n      return a;\n    }})();\n    const stream = new Blob([packed]).stream().pipeThrough(new DecompressionStream(\"gzip\"));\n    const bytes = new Uint8Array(await new Response(stream).arrayBuffer());\n    initSync({{ module: bytes }});\n  }} catch (e) {{\n    const p = document.createElement(\"p\");\n    p.textContent = \"Stresscase could not start in this browser (it needs WebAssembly and DecompressionStream: Chromium 80, Firefox 113, Safari 16.4 or newer): \" + e;\n    document.body.appendChild(p);\n  }}\n  // The offline cache is set up once the page runs, so it does not compete with the start.\n  if (location.protocol === \"http:\" || location.protocol === \"https:\") {{\n    const m = document.createElement(\"link\");\n    m.rel = \"manifest\";\n    m.href = \"manifest.webmanifest\";\n    document.head.appendChild(m);\n    if (\"serviceWorker\" in navigator) navigator.serviceWorker.register(\"sw.js\").catch(() => {{}});\n  }}\n}})();\n",
        b64 = B64.encode(packed_wasm(wasm))
    )
}

fn sha256_b64(text: &str) -> String {
    B64.encode(Sha256::digest(text.as_bytes()))
}

/// The Content-Security-Policy for a page whose only script and style are the given inline ones.
#[must_use]
pub fn csp(script: &str, style: &str) -> String {
    format!(
        "default-src 'none'; script-src 'sha256-{}' 'wasm-unsafe-eval'; style-src 'sha256-{}'; img-src 'self' data:; manifest-src 'self'; worker-src 'self'; connect-src 'self'; base-uri 'none'; form-action 'none'; object-src 'none'",
        sha256_b64(script),
        sha256_b64(style)
    )
}

/// The self-contained page.
#[must_use]
pub fn page(glue: &str, wasm: &[u8], css: &str, icon_svg: &str, masthead: &str) -> String {
    let script = boot_script(glue, wasm);
    let policy = csp(&script, css);
    let icon = format!(
        "data:image/svg+xml;base64,{}",
        B64.encode(icon_svg.as_bytes())
    );
    format!(
        "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<meta http-equiv=\"Content-Security-Policy\" content=\"{policy}\">\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n<meta name=\"description\" content=\"Stresscase: the stress state at one critical point. Runs offline in the browser; nothing is sent anywhere.\">\n<meta name=\"theme-color\" content=\"#17324d\">\n<title>Stresscase — stress at a point</title>\n<link rel=\"icon\" href=\"{icon}\">\n<style>{css}</style>\n</head>\n<body>\n{masthead}\n<noscript>Stresscase needs JavaScript and WebAssembly enabled; nothing is sent anywhere.</noscript>\n<script type=\"module\">{script}</script>\n</body>\n</html>\n"
    )
}

/// The service worker: network first, so an online visit always gets the newest build and
/// refreshes the cache; the cache answers when the network is off or the server fails (a
/// server error never replaces a working offline page). The cache name carries a
/// hash of the page, so a new build replaces the old cache when it activates.
#[must_use]
pub fn service_worker(page: &str) -> String {
    let version = &sha256_b64(page)[..12].replace(['+', '/'], "_");
    format!(
        r#"// Stresscase offline cache. Generated by `cargo xtask build`; do not edit.
const CACHE = "stresscase-{version}";
const FILES = ["./", "index.html", "icon.svg", "manifest.webmanifest"];
self.addEventListener("install", (event) => {{
  event.waitUntil(caches.open(CACHE).then((c) => c.addAll(FILES)).then(() => self.skipWaiting()));
}});
self.addEventListener("activate", (event) => {{
  event.waitUntil(
    caches.keys()
      .then((keys) => Promise.all(keys.filter((k) => k.startsWith("stresscase-") && k !== CACHE).map((k) => caches.delete(k))))
      .then(() => self.clients.claim())
  );
}});
self.addEventListener("fetch", (event) => {{
  const req = event.request;
  if (req.method !== "GET" || new URL(req.url).origin !== self.location.origin) return;
  event.respondWith(
    fetch(req)
      .then((res) => {{
        if (!res.ok) throw new Error("HTTP " + res.status);
        const copy = res.clone();
        caches.open(CACHE).then((c) => c.put(req, copy));
        return res;
      }})
      .catch(() =>
        caches.match(req, {{ ignoreSearch: true }})
          .then((hit) => hit || caches.match("index.html"))
          .then((hit) => hit || fetch(req))
      )
  );
}});
"#
    )
}

const MANIFEST: &str = r##"{
  "name": "Stresscase",
  "short_name": "Stresscase",
  "description": "Stress state at one critical point: principal stresses, Mohr's circles, equivalent stresses. Works offline.",
  "start_url": "./",
  "scope": "./",
  "display": "standalone",
  "background_color": "#fbf8f1",
  "theme_color": "#17324d",
  "icons": [{ "src": "icon.svg", "sizes": "any", "type": "image/svg+xml" }]
}
"##;

const README: &str = "Stresscase — offline folder\n\nOpen index.html in a current browser (Chromium, Chrome, Edge, Firefox): double-click it, or\ndrag it onto a browser window. No network and no installation are needed; nothing is sent\nanywhere. The same folder can be put on any static web server, under any path; visited over\nhttp(s) it keeps working offline after the first visit and can be installed as an app.\n\nResults support, and do not replace, checks under the applicable codes and standards and\nreview by a licensed engineer.\n";

/// Packs `trunk_dir` into `out_dir` (emptied first) and zips it into `zip_path`.
///
/// # Errors
/// On missing trunk output or file errors.
pub fn pack(trunk_dir: &Path, icon: &Path, out_dir: &Path, zip_path: &Path) -> Result<(), String> {
    let read = |p: &Path| fs::read(p).map_err(|e| format!("{}: {e}", p.display()));
    let index =
        String::from_utf8(read(&trunk_dir.join("index.html"))?).map_err(|e| e.to_string())?;
    let files = trunk_files(&index)?;
    let glue = String::from_utf8(read(&trunk_dir.join(&files.js))?).map_err(|e| e.to_string())?;
    let wasm = read(&trunk_dir.join(&files.wasm))?;
    let css = String::from_utf8(read(&trunk_dir.join(&files.css))?).map_err(|e| e.to_string())?;
    let icon_svg = String::from_utf8(read(icon)?).map_err(|e| e.to_string())?;
    let html = page(&glue, &wasm, &css, &icon_svg, &files.masthead);
    let outputs: [(&str, Vec<u8>); 5] = [
        ("index.html", html.clone().into_bytes()),
        ("sw.js", service_worker(&html).into_bytes()),
        ("manifest.webmanifest", MANIFEST.as_bytes().to_vec()),
        ("icon.svg", icon_svg.into_bytes()),
        ("README.txt", README.as_bytes().to_vec()),
    ];
    if out_dir.exists() {
        fs::remove_dir_all(out_dir).map_err(|e| format!("{}: {e}", out_dir.display()))?;
    }
    fs::create_dir_all(out_dir).map_err(|e| format!("{}: {e}", out_dir.display()))?;
    for (name, bytes) in &outputs {
        fs::write(out_dir.join(name), bytes).map_err(|e| format!("{name}: {e}"))?;
    }
    let file = fs::File::create(zip_path).map_err(|e| format!("{}: {e}", zip_path.display()))?;
    let mut zip = zip::ZipWriter::new(file);
    let opts = zip::write::SimpleFileOptions::default()
        .compression_method(zip::CompressionMethod::Deflated);
    for (name, bytes) in &outputs {
        zip.start_file(format!("stresscase/{name}"), opts)
            .map_err(|e| e.to_string())?;
        zip.write_all(bytes).map_err(|e| e.to_string())?;
    }
    zip.finish().map_err(|e| e.to_string())?;
    eprintln!(
        "xtask: packed {} ({} KB page) and {}",
        out_dir.display(),
        html.len() / 1024,
        zip_path.display()
    );
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    const TRUNK_INDEX: &str = "<header class=\"masthead\"><h1>S</h1></header>\n<link rel=\"stylesheet\" href=\"./style-abc.css\" integrity=\"x\"/>\n<script type=\"module\">\nimport init, * as bindings from './app-123.js';\nconst wasm = await init({ module_or_path: './app-123_bg.wasm' });\n</script>";

    #[test]
    fn finds_trunk_outputs() {
        assert_eq!(
            trunk_files(TRUNK_INDEX),
            Ok(TrunkFiles {
                js: "app-123.js".into(),
                wasm: "app-123_bg.wasm".into(),
                css: "style-abc.css".into(),
                masthead: "<header class=\"masthead\"><h1>S</h1></header>".into(),
            })
        );
        assert!(trunk_files("<html></html>").is_err());
    }

    #[test]
    fn page_is_self_contained_and_its_policy_matches_its_inline_code() {
        let html = page(
            "export function initSync(m) {}",
            b"\0asm",
            "body{}",
            "<svg/>",
            "<header class=\"masthead\"><h1>S</h1></header>",
        );
        assert!(html.contains("<body>\n<header class=\"masthead\"><h1>S</h1></header>"));
        for banned in ["src=\"", "href=\"http", "import ", "fetch("] {
            assert!(!html.contains(banned), "page contains {banned:?}");
        }
        let script = html
            .split("<script type=\"module\">")
            .nth(1)
            .and_then(|s| s.split("</script>").next())
            .unwrap();
        let style = html
            .split("<style>")
            .nth(1)
            .and_then(|s| s.split("</style>").next())
            .unwrap();
        assert!(html.contains(&csp(script, style)));
        assert!(script.contains("initSync({ module: bytes })"));
        assert!(script.contains("new DecompressionStream(\"gzip\")"));
        // The embedded module is the wasm gzipped: it inflates back to the same bytes.
        let b64 = script
            .split("const b64 = \"")
            .nth(1)
            .and_then(|s| s.split('"').next())
            .unwrap();
        let gz = B64.decode(b64).unwrap();
        let mut back = Vec::new();
        std::io::Read::read_to_end(&mut flate2::read::GzDecoder::new(&gz[..]), &mut back).unwrap();
        assert_eq!(back, b"\0asm");
        assert!(
            !csp(script, style).contains("unsafe-inline")
                && !csp(script, style).contains("'unsafe-eval'")
        );
    }

    #[test]
    fn a_new_build_gets_a_new_cache() {
        assert_ne!(service_worker("page one"), service_worker("page two"));
        assert!(service_worker("x").contains("caches.delete"));
    }
}
