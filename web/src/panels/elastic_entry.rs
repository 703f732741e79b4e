//! "Elastic constants": E, ν and the free thermal strain α·ΔT, used for rosettes, for strains,
//! and for the strain state shown with every case.

use crate::case::CaseForm;
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::number_field::SourceFields;
use crate::source::ELASTIC;
use leptos::prelude::*;
use stresscase_core::StressUnit;

/// The panel.
#[component]
pub fn ElasticEntry(form: RwSignal<CaseForm>) -> impl IntoView {
    view! {
        <fieldset class="panel" id="panel-elastic">
            <legend>"Elastic constants (isotropic)"</legend>
            <ChoiceSelect form=form id="modulus-unit" label="E in"
                options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                get=|f| f.choices.modulus_unit.symbol()
                set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_modulus_unit(u); }/>
            <SourceFields form=form nums=ELASTIC.to_vec()/>
            <p class="hint">"The defaults are round values typical of steel (common practice), not a material's data. E > 0 and −1 < ν < 0.5."</p>
        </fieldset>
    }
}
