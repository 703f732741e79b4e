//! "Turn the element": the angle θ, typed or dragged, with jumps to the principal and
//! maximum-shear faces.

use crate::model::case::{CaseForm, Field};
use crate::model::entry::parse_number;
use crate::model::evaluation::Evaluation;
use crate::panels::number_field::NumberField;
use leptos::prelude::*;
use stresscase_core::AngleUnit;

/// The angle control.
#[component]
pub fn ElementTurn(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let jump = move |pick: fn(&Evaluation) -> f64| {
        if let Some(e) = shown.get_untracked() {
            form.update(|f| f.set_angle_radians(pick(&e)));
        }
    };
    // With an isotropic in-plane state every face is principal: there is no face to jump to.
    let isotropic =
        Memo::new(move |_| shown.with(|e| e.as_ref().is_some_and(|e| e.in_plane.isotropic)));
    // The slider spans a half turn either way in the current unit.
    let span = move || form.with(|f| f.angle_unit.from_radians(core::f64::consts::PI));
    let step = move || {
        form.with(|f| {
            if f.angle_unit == AngleUnit::Degree {
                0.5
            } else {
                0.005
            }
        })
    };
    view! {
        <fieldset class="panel" id="panel-turn">
            <legend><h2 class="panel-title">"Turn the element"</h2></legend>
            <div class="angle-row">
                <NumberField form=form field=Field::Angle/>
                <label class="unit-pick">
                    "in "
                    <select id="angle-unit"
                        prop:value=move || form.with(|f| if f.angle_unit == AngleUnit::Degree { "deg" } else { "rad" })
                        on:change:target=move |ev| {
                            let to = if ev.target().value() == "rad" { AngleUnit::Radian } else { AngleUnit::Degree };
                            form.update(|f| f.change_angle_unit(to));
                        }>
                        <option value="deg">"degrees"</option>
                        <option value="rad">"radians"</option>
                    </select>
                </label>
            </div>
            <label class="slider-label" for="angle-slider">"Drag to turn θ"</label>
            <input type="range" id="angle-slider"
                prop:min=move || format!("{}", -span()) prop:max=move || format!("{}", span()) prop:step=move || step().to_string()
                prop:value=move || form.with(|f| parse_number(&f.angle).map(|v| v.to_string()).unwrap_or_default())
                on:input:target=move |ev| form.update(|f| f.angle = ev.target().value())/>
            <div class="buttons">
                <button type="button" id="to-principal" prop:disabled=move || isotropic.get() on:click=move |_| jump(|e| e.in_plane.theta_p)>"To principal face θp"</button>
                <button type="button" id="to-shear" prop:disabled=move || isotropic.get() on:click=move |_| jump(|e| e.in_plane.theta_s)>"To max in-plane shear face θs"</button>
                <button type="button" id="to-zero" on:click=move |_| form.update(|f| f.angle = "0".into())>"Back to x, y"</button>
            </div>
            <p class="hint">"θ turns x′ counter-clockwise from x (z out of the page)."</p>
            <p class="hint" id="isotropic-note" hidden=move || !isotropic.get()>"σx = σy and τxy = 0: the state is isotropic in the plane, so every direction is principal (any direction) and no in-plane face carries shear."</p>
        </fieldset>
    }
}
