//! The notice shown while an input is invalid: what is wrong, and that every figure on the page
//! is the last valid result (stale) — or, when no input has ever been valid (a link opened with
//! a value that cannot be honoured), that there is no result yet. It sits in a live region, so
//! screen readers announce it when it appears. [`StaleBadge`] marks each panel heading.

use crate::model::case::{CaseForm, FieldProblem};
use crate::model::evaluation::Evaluation;
use leptos::prelude::*;

/// Lists the invalid fields inside a polite live region that is always in the page (a region
/// added together with its text is not announced).
#[component]
pub fn StaleNotice(
    form: RwSignal<CaseForm>,
    result: Memo<Result<Evaluation, Vec<FieldProblem>>>,
    shown: Memo<Option<Evaluation>>,
) -> impl IntoView {
    let notice = move || {
        result.with(|r| match r {
            Ok(_) => ().into_any(),
            Err(problems) => {
                let items = problems
                    .iter()
                    .map(|p| view! { <li>{format!("{}: {}", form.with_untracked(|f| f.label(p.field)), p.message)}</li> })
                    .collect_view();
                let has_last = shown.with(Option::is_some);
                let lead = if has_last {
                    "Showing stale results: every figure on this page is from the last valid input. "
                } else {
                    "No result yet: this case has not computed once. "
                };
                let then = if has_last {
                    "Fix the marked input to update them:"
                } else {
                    "Fix the marked input to see its results:"
                };
                view! {
                    <div class="stale-notice" id="stale-notice" data-has-result=if has_last { "true" } else { "false" }>
                        <strong>{lead}</strong>
                        {then}
                        <ul>{items}</ul>
                    </div>
                }
                .into_any()
            }
        })
    };
    view! {
        <div id="stale-live" class="stale-live" role="status" aria-live="polite" aria-atomic="true">{notice}</div>
    }
}

/// "stale" beside a panel heading while the page shows the last valid result.
#[component]
pub fn StaleBadge(stale: Memo<bool>) -> impl IntoView {
    view! {
        <span class="stale-badge" hidden=move || !stale.get()>" stale — last valid input"</span>
    }
}
