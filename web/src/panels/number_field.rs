//! One labelled number input that validates as you type and says what is wrong.

use crate::case::{CaseForm, Field};
use leptos::prelude::*;

/// The unit text beside a field.
fn unit_of(form: &CaseForm, field: Field) -> String {
    match field {
        Field::Angle => form.angle_unit.symbol().into(),
        Field::Nx | Field::Ny | Field::Nz => String::new(),
        _ => form.unit.symbol().into(),
    }
}

/// A text input bound to one field of the case.
#[component]
pub fn NumberField(form: RwSignal<CaseForm>, field: Field) -> impl IntoView {
    let problem = Memo::new(move |_| form.with(|f| f.problem(field)));
    let active = Memo::new(move |_| form.with(|f| f.is_active(field)));
    let msg_id = format!("{}-msg", field.id());
    view! {
        <div class="field" class:invalid=move || problem.with(Option::is_some) class:inactive=move || !active.get()>
            <label for=field.id()>{field.label()}</label>
            <input
                type="text"
                inputmode="decimal"
                autocomplete="off"
                spellcheck="false"
                id=field.id()
                aria-describedby=msg_id.clone()
                aria-invalid=move || if problem.with(Option::is_some) { "true" } else { "false" }
                prop:disabled=move || !active.get()
                prop:value=move || form.with(|f| f.text(field).to_string())
                on:input:target=move |ev| form.update(|f| f.set_text(field, ev.target().value()))
            />
            <span class="unit">{move || form.with(|f| unit_of(f, field))}</span>
            <span class="field-msg" id=msg_id>{move || problem.get().unwrap_or_default()}</span>
        </div>
    }
}
