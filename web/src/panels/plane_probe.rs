//! "Plane by its normal": the traction on any plane, for resolving the state onto the plane that
//! matters (a weld throat, a crack face, a bond line).

use crate::model::case::{CaseForm, Field};
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_for_entry;
use crate::panels::number_field::NumberField;
use leptos::prelude::*;

/// The normal-vector inputs and presets.
#[component]
pub fn PlaneProbe(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let set_normal = move |n: [f64; 3]| {
        form.update(|f| {
            for (slot, v) in f.normal.iter_mut().zip(n) {
                *slot = format_for_entry((v * 1e6).round() / 1e6);
            }
        });
    };
    view! {
        <fieldset class="panel" id="panel-probe">
            <legend><h2 class="panel-title">"Plane by its normal"</h2></legend>
            <div class="component-grid three">
                {Field::NORMAL.into_iter().map(|field| view! { <NumberField form=form field=field/> }).collect_view()}
            </div>
            <p class="hint">"Any length; it is made a unit vector. Shown as point N on the diagram."</p>
            <div class="buttons">
                <button type="button" id="probe-oct" on:click=move |_| set_normal([1.0, 1.0, 1.0])>"Octahedral (1, 1, 1)"</button>
                <button type="button" id="probe-taumax" on:click=move |_| {
                    if let Some(e) = shown.get_untracked() {
                        let n = e.mohr3d.tau_max_normals()[0];
                        set_normal([n.x, n.y, n.z]);
                    }
                }>"Plane of τmax"</button>
            </div>
        </fieldset>
    }
}
