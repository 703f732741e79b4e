//! Any text as a saved-cases file: importing never panics, and what imports exports to a file
//! that imports to the same list.
#![no_main]

use stresscase_web::formats::saved::Library;

libfuzzer_sys::fuzz_target!(|data: &[u8]| {
    let text = String::from_utf8_lossy(data);
    if let Ok(lib) = Library::from_json(&text) {
        assert_eq!(Library::from_json(&lib.to_json()), Ok(lib));
    }
});
