//! "Turn the element": the angle θ, typed or dragged, with jumps to the principal and
//! maximum-shear faces.

use crate::case::{CaseForm, Evaluation, Field};
use crate::entry::parse_number;
use crate::numfmt::format_for_entry;
use crate::panels::number_field::NumberField;
use leptos::prelude::*;
use stresscase_core::AngleUnit;

/// The angle control.
#[component]
pub fn ElementTurn(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let jump = move |pick: fn(&Evaluation) -> f64| {
        if let Some(e) = shown.get_untracked() {
            let deg = AngleUnit::Degree.from_radians(pick(&e));
            form.update(|f| f.angle = format_for_entry((deg * 100.0).round() / 100.0));
        }
    };
    view! {
        <fieldset class="panel" id="panel-turn">
            <legend>"Turn the element"</legend>
            <NumberField form=form field=Field::Angle/>
            <input type="range" id="angle-slider" min="-180" max="180" step="0.5" aria-label="θ in degrees"
                prop:value=move || form.with(|f| parse_number(&f.angle).map(|v| v.to_string()).unwrap_or_default())
                on:input:target=move |ev| form.update(|f| f.angle = ev.target().value())/>
            <div class="buttons">
                <button type="button" id="to-principal" on:click=move |_| jump(|e| e.in_plane.theta_p)>"To principal face θp"</button>
                <button type="button" id="to-shear" on:click=move |_| jump(|e| e.in_plane.theta_s)>"To max in-plane shear face θs"</button>
                <button type="button" id="to-zero" on:click=move |_| form.update(|f| f.angle = "0".into())>"Back to x, y"</button>
            </div>
            <p class="hint">"θ turns x′ counter-clockwise from x (z out of the page)."</p>
        </fieldset>
    }
}
