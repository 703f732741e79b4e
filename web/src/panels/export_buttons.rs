//! "Save as SVG / PNG" under each drawing: the drawing as a self-contained SVG file (the page's
//! stylesheet embedded) and as a PNG at twice its size on screen.

use crate::edge::browser;
use leptos::prelude::*;

/// The two buttons for the drawing `#svg_id`; files are named `stresscase-<name>.svg|png`.
#[component]
pub fn ExportButtons(svg_id: &'static str, name: &'static str) -> impl IntoView {
    let status = RwSignal::new(String::new());
    let svg = move |_| {
        let r = browser::svg_document(svg_id, 1.0).and_then(|(text, _, _)| {
            browser::download_as(&format!("stresscase-{name}.svg"), &text, "image/svg+xml")
        });
        status.set(
            r.err()
                .map(|e| format!("Not saved: {e}."))
                .unwrap_or_default(),
        );
    };
    let png = move |_| {
        let r = browser::export_png(svg_id, &format!("stresscase-{name}.png"));
        status.set(
            r.err()
                .map(|e| format!("Not saved: {e}."))
                .unwrap_or_default(),
        );
    };
    view! {
        <div class="buttons export-row">
            <button type="button" id=format!("export-svg-{name}") on:click=svg>"Save as SVG"</button>
            <button type="button" id=format!("export-png-{name}") on:click=png>"Save as PNG (2×)"</button>
            <span class="status" role="status">{move || status.get()}</span>
        </div>
    }
}
