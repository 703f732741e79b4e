//! "Elastic constants": where E, ν and α come from (the chosen material, or typed), the values
//! used, the free thermal strain α·ΔT, and a warning when typed values differ from the chosen
//! material's. [`ElasticNote`] repeats the values used beside the gauge and strain inputs.

use crate::model::case::CaseForm;
use crate::model::choices::{tokens, MaterialPick};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::Place;
use crate::model::numfmt::format_for_entry;
use crate::model::source::ElasticUsed;
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::number_field::SourceFields;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::StressUnit;

/// "E = 68.9 GPa, ν = 0.33, α = 23.6 µε/K — from Aluminium alloy 6061-T6" (or "— typed"), the
/// numbers as the table or the user wrote them.
#[must_use]
pub fn describe(e: &ElasticUsed, modulus_unit: StressUnit) -> String {
    format!(
        "E = {} {}, ν = {}, α = {} µε/K — {}",
        format_for_entry(e.e),
        modulus_unit.symbol(),
        format_for_entry(e.nu),
        format_for_entry(e.alpha),
        e.from
            .map_or_else(|| "typed".to_string(), |m| format!("from {m}")),
    )
}

/// The line that says which E, ν and α turn strains into stress, and where they come from.
#[component]
pub fn ElasticNote(
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
    id: &'static str,
) -> impl IntoView {
    let text = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                format!(
                    "Hooke's law with {}.",
                    describe(&e.elastic, e.choices.modulus_unit)
                )
            })
        })
    };
    let mismatch = move || shown.with(|e| e.as_ref().and_then(|e| e.elastic.mismatch.clone()));
    view! {
        <p class="elastic-note" id=id class:stale=move || stale.get()>{text}</p>
        {move || mismatch().map(|m| view! { <p class="warnings mismatch" role="note">{m}</p> })}
    }
}

/// The panel.
#[component]
pub fn ElasticEntry(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let own = Memo::new(move |_| choices.with(|c| c.material == MaterialPick::Own));
    let typed = Memo::new(move |_| choices.with(|c| c.elastic_typed()));
    view! {
        <fieldset class="panel" id="panel-elastic">
            <legend><h2 class="panel-title">"Elastic constants (isotropic)"</h2></legend>
            <div hidden=move || own.get()>
                <ChoiceSelect form=form id="elastic-from" label="E, ν and α"
                    options=vec![("mat", "from the material chosen under “Will it hold?”"), ("typed", "typed below")]
                    get=|f| tokens::token(&tokens::ELASTIC_FROM, f.choices.elastic)
                    set=|f, v| if let Some(x) = tokens::value(&tokens::ELASTIC_FROM, v) { f.set_elastic(x); }/>
            </div>
            <div hidden=move || !typed.get()>
                <ChoiceSelect form=form id="modulus-unit" label="E in"
                    options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                    get=|f| f.choices.modulus_unit.symbol()
                    set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_modulus_unit(u); }/>
            </div>
            <SourceFields form=form place=Place::Elastic/>
            <ElasticNote shown=shown stale=stale id="elastic-source"/>
            <p class="hint">"They turn gauge readings and strains into stress, and every stress into the strain state shown with the results. Your own material has no elastic constants: type them. E > 0 and −1 < ν < 0.5."</p>
        </fieldset>
    }
}
