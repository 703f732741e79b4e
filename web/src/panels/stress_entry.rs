//! "Stress at the point": mode, unit and the six components.

use crate::case::{CaseForm, Field, Mode};
use crate::panels::number_field::NumberField;
use leptos::prelude::*;
use stresscase_core::StressUnit;

/// The panel where the stress components are typed.
#[component]
pub fn StressEntry(form: RwSignal<CaseForm>) -> impl IntoView {
    let options = StressUnit::ALL
        .iter()
        .map(|u| view! { <option value=u.symbol()>{u.symbol()}</option> })
        .collect_view();
    view! {
        <fieldset class="panel" id="panel-stress">
            <legend>"Stress at the point"</legend>
            <p class="case-title" id="case-title">{move || form.with(|f| f.title.clone())}</p>
            <div class="mode-switch" role="radiogroup" aria-label="Stress state">
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
            <div class="component-grid">
                {Field::STRESS.into_iter().map(|field| view! { <NumberField form=form field=field/> }).collect_view()}
            </div>
            <p class="hint">"Decimal point or comma; exponents like 1.5e3 are fine."</p>
        </fieldset>
    }
}
