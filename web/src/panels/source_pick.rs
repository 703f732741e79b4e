//! "Where the stress comes from": typed components, loads on a section, a rosette, or strains.

use crate::model::case::{CaseForm, Field};
use crate::model::choices::Source;
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_for_entry;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;

/// Switches the path. Going back to typed components starts from the tensor on screen, so a
/// derived state can be edited by hand.
fn switch(form: &mut CaseForm, to: Source, shown: Option<&Evaluation>) {
    if to == Source::Typed && form.choices.source != Source::Typed {
        if let Some(e) = shown {
            form.mode = e.mode;
            for (field, v) in Field::STRESS.into_iter().zip(e.tensor.components()) {
                form.set_text(field, format_for_entry(v));
            }
        }
    }
    form.choices.source = to;
    form.choices.keep_cycle_valid();
}

/// The radio group.
#[component]
pub fn SourcePick(form: RwSignal<CaseForm>, shown: Memo<Option<Evaluation>>) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let options = [
        (Source::Typed, "src-typed", "Stress components, typed in"),
        (
            Source::Section,
            "src-section",
            "Loads on a section or a vessel",
        ),
        (
            Source::Rosette,
            "src-rosette",
            "Strain-gauge rosette readings",
        ),
        (Source::Strain, "src-strain", "Strains, through Hooke's law"),
    ];
    view! {
        <fieldset class="panel" id="panel-source">
            <legend><h2 class="panel-title">"Where the stress comes from"</h2></legend>
            <div class="mode-switch source-switch" role="radiogroup" aria-label="Where the stress comes from">
                {options.into_iter().map(|(src, id, text)| view! {
                    <label>
                        <input type="radio" name="source" id=id
                            prop:checked=move || choices.with(|c| c.source == src)
                            on:change=move |_| shown.with_untracked(|e| form.update(|f| switch(f, src, e.as_ref())))/>
                        {text}
                    </label>
                }).collect_view()}
            </div>
            <p class="hint">"Many points — an FE export or a logger file? "
                <button type="button" id="to-table" on:click=move |_| crate::edge::browser::show_element("table-heading")>"Go to the table"</button>
            </p>
        </fieldset>
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::Mode;

    #[test]
    fn back_to_typed_keeps_the_derived_tensor() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Rosette;
        let e = f.evaluate().unwrap();
        switch(&mut f, Source::Typed, Some(&e));
        let typed = f.evaluate().unwrap();
        for (a, b) in e.tensor.components().iter().zip(typed.tensor.components()) {
            assert!((a - b).abs() <= 1e-9 * (1.0 + a.abs()), "{a} vs {b}");
        }
        assert_eq!(f.mode, Mode::Plane);
    }
}
