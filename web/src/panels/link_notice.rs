//! The notice shown when a case link could not be opened: the reason, and that the last case is
//! still on screen.

use leptos::prelude::*;

/// Shows `problem` until dismissed.
#[component]
pub fn LinkNotice(problem: RwSignal<Option<String>>) -> impl IntoView {
    move || {
        problem.get().map(|p| {
            view! {
                <div class="link-notice" id="link-notice" role="alert">
                    <strong>"This link could not be opened: "</strong>
                    <span id="link-notice-reason">{p}</span>
                    ". Your last case is shown instead. "
                    <button type="button" id="link-notice-close" on:click=move |_| problem.set(None)>"Dismiss"</button>
                </div>
            }
        })
    }
}
