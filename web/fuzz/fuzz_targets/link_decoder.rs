//! Any text as a case link: decoding never panics, and what decodes writes back to a link that
//! decodes to the same case.
#![no_main]

use stresscase_web::formats::link::Case;

libfuzzer_sys::fuzz_target!(|data: &[u8]| {
    let text = String::from_utf8_lossy(data);
    if let Ok(case) = Case::from_link(&text) {
        assert_eq!(Case::from_link(&case.to_link()), Ok(case));
    }
});
