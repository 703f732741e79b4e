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

/// Offers `text` as a file download named `name`.
///
/// # Errors
/// When the browser refuses to make the file.
pub fn download(name: &str, text: &str) -> Result<(), String> {
    let w = web_sys::window().ok_or("no window")?;
    let doc = w.document().ok_or("no document")?;
    let parts = js_sys::Array::of1(&JsValue::from_str(text));
    let opts = web_sys::BlobPropertyBag::new();
    opts.set_type("application/json");
    let blob = web_sys::Blob::new_with_str_sequence_and_options(&parts, &opts)
        .map_err(|e| describe(&e))?;
    let url = web_sys::Url::create_object_url_with_blob(&blob).map_err(|e| describe(&e))?;
    let a: web_sys::HtmlAnchorElement = doc
        .create_element("a")
        .map_err(|e| describe(&e))?
        .unchecked_into();
    a.set_href(&url);
    a.set_download(name);
    a.click();
    // Revoking at once can cancel the download; the file is small, so free it a minute later.
    leptos::prelude::set_timeout(
        move || {
            let _ = web_sys::Url::revoke_object_url(&url);
        },
        std::time::Duration::from_secs(60),
    );
    Ok(())
}

/// Reads the first file chosen in a file input as text.
///
/// # Errors
/// When no file is chosen or it cannot be read.
pub async fn read_chosen_file(input: &web_sys::HtmlInputElement) -> Result<String, String> {
    let file = input
        .files()
        .and_then(|f| f.get(0))
        .ok_or("no file chosen")?;
    if file.size() > crate::saved::MAX_FILE as f64 {
        return Err(format!(
            "the file is {} bytes; saved cases files are at most {}",
            file.size(),
            crate::saved::MAX_FILE
        ));
    }
    let text = wasm_bindgen_futures::JsFuture::from(file.text())
        .await
        .map_err(|e| describe(&e))?;
    text.as_string()
        .ok_or_else(|| "the file is not text".into())
}
