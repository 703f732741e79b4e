//! "Strains (Hooke's law)": a strain state — measured, or from another analysis — turned into
//! stress under plane stress, plane strain or in full 3D.

use crate::model::case::CaseForm;
use crate::model::choices::{tokens, Source};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Place;
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::elastic_entry::ElasticNote;
use crate::panels::number_field::SourceFields;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::units::StrainUnit;

/// The panel (shown when the stress comes from strains).
#[component]
pub fn StrainEntry(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let on = Memo::new(move |_| choices.with(|c| c.source == Source::Strain));
    move || {
        on.get().then(|| view! {
            <fieldset class="panel" id="panel-strain">
                <legend><h2 class="panel-title">"Strains (Hooke's law)"</h2></legend>
                <ChoiceSelect form=form id="strain-condition" label="Condition"
                    options=vec![("pstress", "plane stress (σz = 0; εz follows)"), ("pstrain", "plane strain (εz = 0; σz follows)"), ("3d", "full 3D (all six strains)")]
                    get=|f| tokens::token(&tokens::CONDITION, f.choices.condition)
                    set=|f, v| if let Some(c) = tokens::value(&tokens::CONDITION, v) { f.choices.condition = c; }/>
                <ChoiceSelect form=form id="strain-unit" label="strains in"
                    options=vec![("ue", "µε (microstrain)"), ("strain", "strain (m/m)")]
                    get=|f| f.choices.strain_unit.token()
                    set=|f, v| if let Some(u) = StrainUnit::from_token(v) { f.change_strain_unit(u); }/>
                <SourceFields form=form place=Place::Strains/>
                <ElasticNote shown=shown stale=stale id="elastic-used"/>
                <p class="hint">"Shear strains are engineering shear strains γ = 2ε (γ = τ/G). Total strains: the free thermal strain α·ΔT below is taken off before Hooke's law."</p>
            </fieldset>
        })
    }
}
