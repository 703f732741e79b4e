//! "Stress at the point": mode, unit and the six components.

use crate::model::case::{CaseForm, Field, Mode};
use crate::model::choices::Source;
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::{format_sig, RESULT_DIGITS};
use crate::panels::number_field::NumberField;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::StressUnit;

/// Where a derived tensor came from, in words.
fn derived_from(source: Source) -> &'static str {
    match source {
        Source::Section => "From the loads on the section, at the chosen point (point axes)",
        Source::Rosette => "From the rosette, at the gauged surface (plane stress, rosette axes)",
        Source::Strain => "From the strains, by Hooke's law",
        Source::Typed => "",
    }
}

/// The panel where the stress components are typed, or shown when another path derives them.
#[component]
pub fn StressEntry(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let typed = Memo::new(move |_| choices.with(|c| c.source == Source::Typed));
    let derived = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                let u = e.unit.symbol();
                Field::STRESS
                    .into_iter()
                    .zip(e.tensor.components())
                    .map(|(f, v)| {
                        view! {
                            <div class="derived-value">
                                <span class="name">{f.label()}</span>
                                <span class="value" id=format!("derived-{}", &f.id()[3..]) data-value=format!("{v:e}")>
                                    {format!("{} {u}", format_sig(v, RESULT_DIGITS))}
                                </span>
                            </div>
                        }
                    })
                    .collect_view()
            })
        })
    };
    let options = StressUnit::ALL
        .iter()
        .map(|u| view! { <option value=u.symbol()>{u.symbol()}</option> })
        .collect_view();
    view! {
        <fieldset class="panel" id="panel-stress">
            <legend><h2 class="panel-title">"Stress at the point"</h2></legend>
            <p class="case-title" id="case-title">{move || form.with(|f| f.title.clone())}</p>
            <div class="derived" hidden=move || typed.get()>
                <p class="hint">{move || form.with(|f| derived_from(f.choices.source))}</p>
                <div class="component-grid" id="derived-grid">{derived}</div>
            </div>
            <div class="mode-switch" role="radiogroup" aria-label="Stress state" hidden=move || !typed.get()>
                <label>
                    <input type="radio" name="mode" id="mode-plane"
                        prop:checked=move || form.with(|f| f.mode == Mode::Plane)
                        on:change=move |_| form.update(|f| f.mode = Mode::Plane)/>
                    "Plane stress (σz = τyz = τzx = 0)"
                </label>
                <label>
                    <input type="radio" name="mode" id="mode-full"
                        prop:checked=move || form.with(|f| f.mode == Mode::Full)
                        on:change=move |_| form.update(|f| f.mode = Mode::Full)/>
                    "Full 3D tensor"
                </label>
            </div>
            <label class="unit-pick">
                "Stress unit "
                <select id="unit"
                    prop:value=move || form.with(|f| f.unit.symbol())
                    on:change:target=move |ev| {
                        if let Some(u) = StressUnit::from_symbol(&ev.target().value()) {
                            form.update(|f| f.change_unit(u));
                        }
                    }>
                    {options}
                </select>
                <span class="hint">" changing it converts the entered values"</span>
            </label>
            <div class="component-grid" hidden=move || !typed.get()>
                {Field::STRESS.into_iter().map(|field| view! { <NumberField form=form field=field/> }).collect_view()}
            </div>
            <p class="hint">"Decimal point or comma; exponents like 1.5e3 are fine."</p>
        </fieldset>
    }
}
