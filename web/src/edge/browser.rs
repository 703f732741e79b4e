//! The page's few contacts with the browser: local storage, the URL fragment and history, the
//! clipboard, file download and upload. Every call that can fail returns the failure as text
//! for the page to show; none panics.

use wasm_bindgen::{JsCast, JsValue};

/// Local-storage key of the case last on screen (a case link).
pub const CURRENT_KEY: &str = "stresscase.current.v1";
/// Local-storage key of the saved cases (a saved-cases file).
pub const LIBRARY_KEY: &str = "stresscase.library.v1";

fn describe(e: &JsValue) -> String {
    e.dyn_ref::<js_sys::Error>()
        .map(|e| String::from(e.message()))
        .or_else(|| e.as_string())
        .unwrap_or_else(|| "unknown error".into())
}

fn storage() -> Result<web_sys::Storage, String> {
    let none = || {
        "browser storage is unavailable (private mode or disabled); cases will not be kept"
            .to_string()
    };
    let w = web_sys::window().ok_or_else(none)?;
    match w.local_storage() {
        Ok(Some(s)) => Ok(s),
        _ => Err(none()),
    }
}

/// Reads a stored value.
///
/// # Errors
/// When storage is unavailable.
pub fn load(key: &str) -> Result<Option<String>, String> {
    storage()?
        .get_item(key)
        .map_err(|e| format!("reading browser storage failed: {}", describe(&e)))
}

/// Stores a value.
///
/// # Errors
/// When storage is unavailable or full.
pub fn store(key: &str, value: &str) -> Result<(), String> {
    storage()?.set_item(key, value).map_err(|e| {
        let why = describe(&e);
        if why.to_lowercase().contains("quota") {
            "browser storage is full; delete saved cases or export them to a file".to_string()
        } else {
            format!("saving to browser storage failed: {why}")
        }
    })
}

/// Session-storage key of an edit the address bar had not caught up with when the page was
/// left: the fragment it was made from, a newline, and its link.
pub const UNWRITTEN_KEY: &str = "stresscase.unwritten.v1";

/// Keeps `value` for this tab only (session storage: it survives a reload, not a new tab);
/// silently nothing where session storage is unavailable.
pub fn session_put(key: &str, value: &str) {
    if let Some(s) = web_sys::window().and_then(|w| w.session_storage().ok().flatten()) {
        let _ = s.set_item(key, value);
    }
}

/// Takes (reads and removes) a value kept with [`session_put`].
#[must_use]
pub fn session_take(key: &str) -> Option<String> {
    let s = web_sys::window().and_then(|w| w.session_storage().ok().flatten())?;
    let v = s.get_item(key).ok().flatten();
    let _ = s.remove_item(key);
    v
}

/// The URL fragment without `#` (empty when none).
#[must_use]
pub fn hash() -> String {
    web_sys::window()
        .and_then(|w| w.location().hash().ok())
        .map(|h| h.strip_prefix('#').map(str::to_string).unwrap_or(h))
        .unwrap_or_default()
}

/// Puts `link` in the URL fragment, as a new history entry (`push`) or in place.
pub fn set_hash(link: &str, push: bool) {
    let Some(w) = web_sys::window() else { return };
    let Ok(h) = w.history() else { return };
    let url = format!("#{link}");
    let _ = if push {
        h.push_state_with_url(&JsValue::NULL, "", Some(&url))
    } else {
        h.replace_state_with_url(&JsValue::NULL, "", Some(&url))
    };
}

/// The page address with `link` as its fragment.
#[must_use]
pub fn url_with(link: &str) -> String {
    let base = web_sys::window()
        .and_then(|w| w.location().href().ok())
        .map(|h| h.split('#').next().unwrap_or("").to_string())
        .unwrap_or_default();
    format!("{base}#{link}")
}

/// Width in CSS pixels below which the page draws for a phone.
pub const NARROW_WIDTH: f64 = 600.0;

/// Whether the window is narrower than [`NARROW_WIDTH`] (a phone).
#[must_use]
pub fn is_narrow() -> bool {
    web_sys::window()
        .and_then(|w| w.inner_width().ok())
        .and_then(|v| v.as_f64())
        .is_some_and(|w| w < NARROW_WIDTH)
}

/// Opens the browser's print dialog (print or save as PDF the calc sheet).
pub fn print() {
    if let Some(w) = web_sys::window() {
        let _ = w.print();
    }
}

/// The local date and time now, as `YYYY-MM-DD HH:MM` and the UTC offset.
#[must_use]
pub fn now_text() -> String {
    let d = js_sys::Date::new_0();
    let offset = -d.get_timezone_offset();
    format!(
        "{:04}-{:02}-{:02} {:02}:{:02} (UTC{}{:02}:{:02})",
        d.get_full_year(),
        d.get_month() + 1,
        d.get_date(),
        d.get_hours(),
        d.get_minutes(),
        if offset < 0.0 { '−' } else { '+' },
        (offset.abs() / 60.0).floor(),
        offset.abs() % 60.0
    )
}

/// Milliseconds since the epoch.
#[must_use]
pub fn now_ms() -> f64 {
    js_sys::Date::now()
}

/// Copies text to the clipboard.
///
/// # Errors
/// When the clipboard is not available or refuses (e.g. no permission).
pub async fn copy(text: &str) -> Result<(), String> {
    let w = web_sys::window().ok_or("no window")?;
    let promise = w.navigator().clipboard().write_text(text);
    wasm_bindgen_futures::JsFuture::from(promise)
        .await
        .map(|_| ())
        .map_err(|e| describe(&e))
}

/// Offers `text` as a file download named `name`, of media type `mime`.
///
/// # Errors
/// When the browser refuses to make the file.
pub fn download_as(name: &str, text: &str, mime: &str) -> Result<(), String> {
    let parts = js_sys::Array::of1(&JsValue::from_str(text));
    let opts = web_sys::BlobPropertyBag::new();
    opts.set_type(mime);
    let blob = web_sys::Blob::new_with_str_sequence_and_options(&parts, &opts)
        .map_err(|e| describe(&e))?;
    download_blob(name, &blob)
}

/// Offers `text` as a JSON file download named `name`.
///
/// # Errors
/// When the browser refuses to make the file.
pub fn download(name: &str, text: &str) -> Result<(), String> {
    download_as(name, text, "application/json")
}

/// Offers a blob as a file download named `name`.
///
/// # Errors
/// When the browser refuses to make the file.
pub fn download_blob(name: &str, blob: &web_sys::Blob) -> Result<(), String> {
    let w = web_sys::window().ok_or("no window")?;
    let doc = w.document().ok_or("no document")?;
    let url = web_sys::Url::create_object_url_with_blob(blob).map_err(|e| describe(&e))?;
    let a: web_sys::HtmlAnchorElement = doc
        .create_element("a")
        .map_err(|e| describe(&e))?
        .unchecked_into();
    a.set_href(&url);
    a.set_download(name);
    a.click();
    // Revoking at once can cancel the download; free it a minute later.
    leptos::prelude::set_timeout(
        move || {
            let _ = web_sys::Url::revoke_object_url(&url);
        },
        std::time::Duration::from_secs(60),
    );
    Ok(())
}

/// The drawing `#id` as a self-contained SVG document (the page's stylesheet embedded, its
/// displayed size as width and height), with that size in CSS pixels.
///
/// # Errors
/// When there is no such drawing.
pub fn svg_document(id: &str, scale: f64) -> Result<(String, f64, f64), String> {
    let doc = web_sys::window()
        .and_then(|w| w.document())
        .ok_or("no document")?;
    let el = doc
        .get_element_by_id(id)
        .ok_or_else(|| format!("no drawing #{id} on the page"))?;
    let rect = el.get_bounding_client_rect();
    let (w, h) = (rect.width().round(), rect.height().round());
    let css = doc
        .query_selector("style")
        .ok()
        .flatten()
        .and_then(|s| s.text_content())
        .unwrap_or_default();
    Ok((svg_file(&el.outer_html(), &css, w * scale, h * scale), w, h))
}

/// Wraps an `<svg>` element's markup as a standalone file: XML declaration, namespace, size and
/// the stylesheet (in CDATA) as its first child.
#[must_use]
pub fn svg_file(markup: &str, css: &str, width: f64, height: f64) -> String {
    let end = markup.find('>').unwrap_or(markup.len());
    let (open, rest) = markup.split_at(end);
    let mut head = open.to_string();
    if !head.contains("xmlns=") {
        head.push_str(" xmlns=\"http://www.w3.org/2000/svg\"");
    }
    head.push_str(&format!(" width=\"{width}\" height=\"{height}\""));
    let css = css.replace("]]>", "]]]]><![CDATA[>");
    format!(
        "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n{head}><style><![CDATA[{css}]]></style>{}",
        rest.get(1..).unwrap_or("")
    )
}

/// Offers the drawing `#id` as a PNG at twice its displayed size, named `name`.
///
/// # Errors
/// When there is no such drawing or the browser refuses to draw it.
pub fn export_png(id: &str, name: &str) -> Result<(), String> {
    use wasm_bindgen::closure::Closure;
    let (svg, w, h) = svg_document(id, 2.0)?;
    let doc = web_sys::window()
        .and_then(|w| w.document())
        .ok_or("no document")?;
    let canvas: web_sys::HtmlCanvasElement = doc
        .create_element("canvas")
        .map_err(|e| describe(&e))?
        .unchecked_into();
    let (pw, ph) = (2.0 * w, 2.0 * h);
    canvas.set_width(pw as u32);
    canvas.set_height(ph as u32);
    let img = web_sys::HtmlImageElement::new().map_err(|e| describe(&e))?;
    let name = name.to_string();
    let drawn = img.clone();
    let onload = Closure::once(move || {
        let Some(ctx) = canvas
            .get_context("2d")
            .ok()
            .flatten()
            .map(JsCast::unchecked_into::<web_sys::CanvasRenderingContext2d>)
        else {
            return;
        };
        ctx.set_fill_style_str("#ffffff");
        ctx.fill_rect(0.0, 0.0, pw, ph);
        if ctx
            .draw_image_with_html_image_element_and_dw_and_dh(&drawn, 0.0, 0.0, pw, ph)
            .is_err()
        {
            return;
        }
        let done = Closure::once(move |blob: JsValue| {
            if let Ok(blob) = blob.dyn_into::<web_sys::Blob>() {
                let _ = download_blob(&name, &blob);
            }
        });
        let _ = canvas.to_blob(done.as_ref().unchecked_ref());
        done.forget();
    });
    img.set_onload(Some(onload.as_ref().unchecked_ref()));
    onload.forget();
    let encoded: String = js_sys::encode_uri_component(&svg).into();
    img.set_src(&format!("data:image/svg+xml;charset=utf-8,{encoded}"));
    Ok(())
}

/// Reads the first file chosen in a file input as text.
///
/// # Errors
/// When no file is chosen or it cannot be read.
pub async fn read_chosen_file(
    input: &web_sys::HtmlInputElement,
    max_bytes: usize,
    what: &str,
) -> Result<String, String> {
    let file = input
        .files()
        .and_then(|f| f.get(0))
        .ok_or("no file chosen")?;
    if file.size() > max_bytes as f64 {
        return Err(format!(
            "the file is {} bytes; a {what} file is at most {max_bytes}",
            file.size()
        ));
    }
    let text = wasm_bindgen_futures::JsFuture::from(file.text())
        .await
        .map_err(|e| describe(&e))?;
    text.as_string()
        .ok_or_else(|| "the file is not text".into())
}

/// The file chosen in a file input, with its name and size in bytes.
pub fn chosen_file(input: &web_sys::HtmlInputElement) -> Option<(web_sys::File, String, f64)> {
    let f = input.files()?.get(0)?;
    let (name, size) = (f.name(), f.size());
    Some((f, name, size))
}

/// A file read front to back as the browser hands over its bytes (`Blob.stream()`): chunks of
/// whatever size the browser reads (tens of KB to a few MB), never the file whole. Reading
/// the stream is faster than reading the file slice after slice (each slice is a read of its
/// own; about 200 ms against 40–180 ms for a 62 MB file, measured in headless Chromium), and
/// the file's bytes are never held twice. Every browser the page runs in has it (the page needs
/// `DecompressionStream`, which came later).
pub struct FileStream(web_sys::ReadableStreamDefaultReader);

/// Starts reading `file` as a [`FileStream`].
pub fn start_file_stream(file: &web_sys::File) -> Result<FileStream, String> {
    file.stream()
        .get_reader()
        .dyn_into::<web_sys::ReadableStreamDefaultReader>()
        .map(FileStream)
        .map_err(|e| describe(&e))
}

impl FileStream {
    /// The next chunk's bytes, copied into the page's memory; `None` at the end of the file.
    pub async fn next(&mut self) -> Result<Option<Vec<u8>>, String> {
        let read = wasm_bindgen_futures::JsFuture::from(self.0.read())
            .await
            .map_err(|e| describe(&e))?
            .unchecked_into::<web_sys::ReadableStreamReadResult>();
        if read.get_done().unwrap_or(true) {
            return Ok(None);
        }
        let chunk = read.get_value();
        if !chunk.is_instance_of::<js_sys::Uint8Array>() {
            return Err("the file did not read as bytes".into());
        }
        Ok(Some(chunk.unchecked_into::<js_sys::Uint8Array>().to_vec()))
    }

    /// Stops reading (the rest of the file is not read).
    pub fn stop(&self) {
        let _ = self.0.cancel();
    }
}

/// Marks a moment on the page's performance timeline (`performance.mark`), for benchmarks that
/// time the page's own steps; nothing when there is no timeline.
pub fn mark(name: &str) {
    if let Some(p) = web_sys::window().and_then(|w| w.performance()) {
        let _ = p.mark(name);
    }
}

/// Scrolls the element `#id` into view and moves the keyboard focus to it (when it can take
/// focus); nothing when there is no such element.
pub fn show_element(id: &str) {
    let Some(e) = web_sys::window()
        .and_then(|w| w.document())
        .and_then(|d| d.get_element_by_id(id))
    else {
        return;
    };
    e.scroll_into_view();
    if let Ok(h) = e.dyn_into::<web_sys::HtmlElement>() {
        let _ = h.focus();
    }
}

/// Hands control back to the browser until its next task, so it can paint and take input
/// between pieces of long work. The task is a message on a channel of the page's own: unlike a
/// zero-delay timer, which browsers hold back to 4 ms once such waits follow one another, it
/// comes as soon as the browser has done what was waiting (a timer where there is no channel).
pub async fn yield_to_browser() {
    let promise = js_sys::Promise::new(&mut |resolve, _reject| {
        let posted = web_sys::MessageChannel::new().is_ok_and(|channel| {
            channel.port1().set_onmessage(Some(&resolve));
            channel.port2().post_message(&JsValue::NULL).is_ok()
        });
        let queued = posted
            || web_sys::window().is_some_and(|w| {
                w.set_timeout_with_callback_and_timeout_and_arguments_0(&resolve, 0)
                    .is_ok()
            });
        if !queued {
            let _ = resolve.call0(&JsValue::NULL);
        }
    });
    let _ = wasm_bindgen_futures::JsFuture::from(promise).await;
}
