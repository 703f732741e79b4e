//! The banner shown while an input is invalid: what is wrong, and that the pictures are stale.

use crate::case::{CaseForm, Evaluation, FieldProblem};
use leptos::prelude::*;

/// Lists the invalid fields; empty when everything reads.
#[component]
pub fn StaleNotice(
    form: RwSignal<CaseForm>,
    result: Memo<Result<Evaluation, Vec<FieldProblem>>>,
) -> impl IntoView {
    move || {
        result.with(|r| match r {
            Ok(_) => ().into_any(),
            Err(problems) => {
                let items = problems
                    .iter()
                    .map(|p| view! { <li>{format!("{}: {}", form.with_untracked(|f| f.label(p.field)), p.message)}</li> })
                    .collect_view();
                view! {
                    <div class="stale-notice" id="stale-notice" role="status">
                        <strong>"Showing the last valid result (stale). "</strong>
                        "Fix the marked input to update it:"
                        <ul>{items}</ul>
                    </div>
                }
                .into_any()
            }
        })
    }
}
