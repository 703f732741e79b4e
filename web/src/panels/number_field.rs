//! One labelled number input that validates as you type and says what is wrong — both a number
//! that does not read and a value core refuses (e.g. a bore larger than the outside).

use crate::model::case::{CaseForm, Field, FieldProblem};
use crate::model::evaluation::Evaluation;
use leptos::prelude::*;

/// The evaluation result the page shares with its fields, so each field can show core's reason
/// for refusing its value.
pub type SharedResult = Memo<Result<Evaluation, Vec<FieldProblem>>>;

/// A text input bound to one field of the case.
#[component]
pub fn NumberField(form: RwSignal<CaseForm>, field: Field) -> impl IntoView {
    let shared = use_context::<SharedResult>();
    let problem = Memo::new(move |_| {
        form.with(|f| f.problem(field)).or_else(|| {
            shared.and_then(|r| {
                r.with(|r| {
                    r.as_ref().err().and_then(|ps| {
                        ps.iter()
                            .find(|p| p.field == field)
                            .map(|p| p.message.clone())
                    })
                })
            })
        })
    });
    let active = Memo::new(move |_| form.with(|f| f.is_active(field)));
    let msg_id = format!("{}-msg", field.id());
    view! {
        <div class="field" class:invalid=move || problem.with(Option::is_some) class:inactive=move || !active.get()>
            <label for=field.id()>{move || form.with(|f| f.label(field))}</label>
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
            <span class="unit">{move || form.with(|f| f.unit_of(field))}</span>
            <span class="field-msg" id=msg_id>{move || problem.get().unwrap_or_default()}</span>
        </div>
    }
}

/// The fields drawn at `place` that the case's current choices use, re-drawn only when that
/// set changes (so typing never rebuilds an input under the cursor).
#[component]
pub fn SourceFields(form: RwSignal<CaseForm>, place: crate::model::inputs::Place) -> impl IntoView {
    let nums = place.numbers();
    let shown = Memo::new(move |_| {
        let active = form.with(|f| f.choices.active());
        nums.iter()
            .copied()
            .filter(|n| active.contains(n))
            .collect::<Vec<_>>()
    });
    view! {
        <div class="component-grid">
            {move || shown.get().into_iter().map(|n| view! { <NumberField form=form field=Field::Src(n)/> }).collect_view()}
        </div>
    }
}
