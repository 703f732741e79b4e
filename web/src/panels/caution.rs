//! The standing caution at the top of the page.

use leptos::prelude::*;

/// Always visible: what these numbers are and are not.
#[component]
pub fn CautionNote() -> impl IntoView {
    view! {
        <aside class="caution" id="caution" role="note">
            <strong>"Engineering aid, not a design authority. "</strong>
            "Results support, and do not replace, checks under the applicable codes and standards and review by a licensed engineer. "
            "Check inputs, units and sign conventions before relying on any number."
        </aside>
    }
}
