//! One labelled number input that validates as you type and says what is wrong — both a number
//! that does not read and a value core refuses (e.g. a bore larger than the outside).

use crate::model::case::{CaseForm, Field, FieldProblem};
use crate::model::evaluation::Evaluation;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;

/// The evaluation result the page shares with its fields, so each field can show core's reason
/// for refusing its value.
pub type SharedResult = Memo<Result<Evaluation, Vec<FieldProblem>>>;

/// What one field shows of the form. Read from the form once a keystroke, so the form has one
/// subscriber per field, and each part of the field is redrawn only when it changes.
#[derive(Debug, Clone, PartialEq)]
struct FieldState {
    label: String,
    text: String,
    unit: &'static str,
    active: bool,
    problem: Option<String>,
}

/// A text input bound to one field of the case.
#[component]
pub fn NumberField(form: RwSignal<CaseForm>, field: Field) -> impl IntoView {
    let shared = use_context::<SharedResult>();
    let state = Memo::new(move |_| {
        form.with(|f| FieldState {
            label: f.label(field),
            text: f.text(field).to_string(),
            unit: f.unit_of(field),
            active: f.is_active(field),
            problem: f.problem(field),
        })
    });
    let problem = Memo::new(move |_| {
        state.with(|s| s.problem.clone()).or_else(|| {
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
    let active = Memo::new(move |_| state.with(|s| s.active));
    let msg_id = format!("{}-msg", field.id());
    view! {
        <div class="field" class:invalid=move || problem.with(Option::is_some) class:inactive=move || !active.get()>
            <label for=field.id()>{move || state.with(|s| s.label.clone())}</label>
            <input
                type="text"
                inputmode="decimal"
                autocomplete="off"
                spellcheck="false"
                id=field.id()
                aria-describedby=msg_id.clone()
                aria-invalid=move || if problem.with(Option::is_some) { "true" } else { "false" }
                prop:disabled=move || !active.get()
                prop:value=move || state.with(|s| s.text.clone())
                on:input:target=move |ev| form.update(|f| f.set_text(field, ev.target().value()))
            />
            <span class="unit">{move || state.with(|s| s.unit)}</span>
            <span class="field-msg" id=msg_id>{move || problem.get().unwrap_or_default()}</span>
        </div>
    }
}

/// The fields drawn at `place` that the case's current choices use, re-drawn only when that
/// set changes (so typing never rebuilds an input under the cursor).
#[component]
pub fn SourceFields(form: RwSignal<CaseForm>, place: crate::model::inputs::Place) -> impl IntoView {
    let nums = place.numbers();
    let choices = SharedCase::of(form).choices;
    let shown = Memo::new(move |_| {
        choices.with(|c| {
            nums.iter()
                .copied()
                .filter(|&n| c.uses(n))
                .collect::<Vec<_>>()
        })
    });
    view! {
        <div class="component-grid">
            {move || shown.get().into_iter().map(|n| view! { <NumberField form=form field=Field::Src(n)/> }).collect_view()}
        </div>
    }
}
