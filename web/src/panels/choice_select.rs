//! One labelled drop-down bound to a choice of the case (a unit, a kind, a layout).

use crate::model::case::CaseForm;
use leptos::prelude::*;

/// A select whose value is read by `get` and written by `set` (which also converts whatever
/// the choice affects, e.g. typed values on a unit change).
#[component]
pub fn ChoiceSelect(
    form: RwSignal<CaseForm>,
    id: &'static str,
    label: &'static str,
    options: Vec<(&'static str, &'static str)>,
    get: fn(&CaseForm) -> &'static str,
    set: fn(&mut CaseForm, &str),
) -> impl IntoView {
    let options = options
        .into_iter()
        .map(|(value, text)| view! { <option value=value>{text}</option> })
        .collect_view();
    view! {
        <label class="unit-pick">
            {label}" "
            <select id=id
                prop:value=move || form.with(get)
                on:change:target=move |ev| form.update(|f| set(f, &ev.target().value()))>
                {options}
            </select>
        </label>
    }
}
