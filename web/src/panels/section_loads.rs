//! "Loads on a section": the section kind and size, the loads, pressure and stress concentration
//! factors, and the point; units for each; the cautions that go with beam formulas.

use crate::formats::link::Case;
use crate::model::case::{CaseForm, Field};
use crate::model::choices::{tokens, SectionKind, Source, Surface};
use crate::model::evaluation::Evaluation;
use crate::model::inputs::{Num, Place};
use crate::model::numfmt::format_for_entry;
use crate::model::source::{self, Outcome};
use crate::panels::choice_select::ChoiceSelect;
use crate::panels::notch_shape::{FittedFactors, NotchShape};
use crate::panels::number_field::SourceFields;
use crate::panels::section_sketch::SectionSketch;
use crate::panels::shared_case::SharedCase;
use leptos::prelude::*;
use stresscase_core::section::Section;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit};
use stresscase_core::vessel::Ends;
use stresscase_core::StressUnit;

fn kind_text(k: SectionKind) -> &'static str {
    match k {
        SectionKind::SolidRound => "solid round shaft",
        SectionKind::Tube => "tube (thick or thin wall)",
        SectionKind::Rectangle => "solid rectangle",
        SectionKind::ThinCylinder => "thin-walled cylinder (pressure)",
        SectionKind::ThinSphere => "thin-walled sphere (pressure)",
    }
}

/// Sets the tube point radius to its outer or inner radius, read from core's section.
fn to_surface(form: &mut CaseForm, outer: bool) {
    let Ok(case) = Case::from_form(form) else {
        return;
    };
    if let Ok(Section::Round(r)) = source::section(&case.choices, &case) {
        let m = form.choices.length.metres();
        let radius = if outer {
            r.outer_radius()
        } else {
            r.inner_radius()
        };
        form.set_text(Field::Src(Num::R), format_for_entry(radius / m));
    }
}

/// The panel (shown when the stress comes from loads on a section).
#[component]
pub fn SectionLoads(
    form: RwSignal<CaseForm>,
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
) -> impl IntoView {
    let choices = SharedCase::of(form).choices;
    let on = Memo::new(move |_| choices.with(|c| c.source == Source::Section));
    let kind = Memo::new(move |_| choices.with(|c| c.kind));
    let kinds: Vec<(&'static str, &'static str)> = tokens::KIND
        .iter()
        .map(|(k, t)| (*t, kind_text(*k)))
        .collect();
    let warnings = Memo::new(move |_| {
        shown.with(|e| match e.as_ref().and_then(|e| e.outcome.as_ref()) {
            Some(Outcome::Section(s)) => s.warnings.clone(),
            _ => vec![],
        })
    });
    move || {
        on.get().then(|| {
            let k = kind.get();
            let thin = matches!(k, SectionKind::ThinCylinder | SectionKind::ThinSphere);
            view! {
                <fieldset class="panel" id="panel-section">
                    <legend><h2 class="panel-title">"Loads on a section"</h2></legend>
                    <ChoiceSelect form=form id="section-kind" label="Section" options=kinds.clone()
                        get=|f| tokens::token(&tokens::KIND, f.choices.kind)
                        set=|f, v| if let Some(k) = tokens::value(&tokens::KIND, v) {
                            f.choices.kind = k;
                            f.choices.keep_cycle_valid();
                            // Thin cylinders have closed or open ends only.
                            if k == SectionKind::ThinCylinder && f.choices.ends == Ends::PlaneStrain {
                                f.choices.ends = Ends::Closed;
                            }
                        }/>
                    <div class="unit-row">
                        <ChoiceSelect form=form id="length-unit" label="lengths in"
                            options=LengthUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                            get=|f| f.choices.length.symbol()
                            set=|f, v| if let Some(u) = LengthUnit::from_symbol(v) { f.change_length_unit(u); }/>
                        {(!thin).then(|| view! {
                            <ChoiceSelect form=form id="force-unit" label="forces in"
                                options=ForceUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                                get=|f| f.choices.force.symbol()
                                set=|f, v| if let Some(u) = ForceUnit::from_symbol(v) { f.change_force_unit(u); }/>
                            <ChoiceSelect form=form id="moment-unit" label="moments in"
                                options=MomentUnit::ALL.iter().map(|u| (u.token(), u.symbol())).collect()
                                get=|f| f.choices.moment.token()
                                set=|f, v| if let Some(u) = MomentUnit::from_token(v) { f.change_moment_unit(u); }/>
                        })}
                        {(k != SectionKind::Rectangle).then(|| view! {
                            <ChoiceSelect form=form id="pressure-unit" label="pressure in"
                                options=StressUnit::ALL.iter().map(|u| (u.symbol(), u.symbol())).collect()
                                get=|f| f.choices.pressure.symbol()
                                set=|f, v| if let Some(u) = StressUnit::from_symbol(v) { f.change_pressure_unit(u); }/>
                        })}
                    </div>
                    <h3>"Size"</h3>
                    <SourceFields form=form place=Place::Dimensions/>
                    {(!thin).then(|| view! {
                        <h3>"Loads on the +x face"</h3>
                        <SourceFields form=form place=Place::Loads/>
                    })}
                    {(k != SectionKind::Rectangle).then(|| view! {
                        <h3>"Pressure"</h3>
                        <SourceFields form=form place=Place::Pressures/>
                    })}
                    {(k != SectionKind::ThinSphere && k != SectionKind::Rectangle).then(|| view! {
                        <ChoiceSelect form=form id="ends" label="Ends"
                            options={
                                let mut o = vec![("closed", "closed: the wall carries the pressure end load"), ("open", "open: no axial stress from pressure")];
                                if k != SectionKind::ThinCylinder {
                                    o.push(("pstrain", "plane strain: axially restrained, σz = ν(σr + σθ)"));
                                }
                                o
                            }
                            get=|f| tokens::token(&tokens::ENDS, f.choices.ends)
                            set=|f, v| if let Some(e) = tokens::value(&tokens::ENDS, v) { f.choices.ends = e; }/>
                    })}
                    {(!thin).then(|| view! {
                        <h3>"Stress concentration at the point"</h3>
                        <NotchShape form=form/>
                        <SourceFields form=form place=Place::Concentration/>
                        <FittedFactors form=form shown=shown stale=stale/>
                        <label class="check">
                            <input type="checkbox" id="static-kt" prop:checked=move || choices.with(|c| c.static_kt)
                                on:change:target=move |ev| form.update(|f| f.choices.static_kt = ev.target().checked())/>
                            " apply Kt and Kts to the state on screen and the static check"
                        </label>
                        <p class="hint">"Kt multiplies σx from N, My, Mz; Kts the shear from T, Vy, Vz. Pressure stresses are not multiplied. Use 1 away from notches. Common practice applies Kt statically to brittle materials only: a ductile material yields locally and the peak is relieved. In fatigue the section uses Kf = 1 + q(Kt − 1) and Kfs = 1 + qs(Kts − 1) (see Fatigue)."</p>
                    })}
                    <h3>"The point"</h3>
                    {(k == SectionKind::Rectangle).then(|| view! {
                        <ChoiceSelect form=form id="face" label="on the face"
                            options=vec![("+y", "+y (y = h/2)"), ("+z", "+z (z = b/2)"), ("-y", "−y (y = −h/2)"), ("-z", "−z (z = −b/2)")]
                            get=|f| tokens::token(&tokens::FACE, f.choices.face)
                            set=|f, v| if let Some(x) = tokens::value(&tokens::FACE, v) { f.choices.face = x; }/>
                    })}
                    {thin.then(|| view! {
                        <ChoiceSelect form=form id="surface" label="surface"
                            options=vec![("inner", "inner (σr = −p)"), ("outer", "outer (σr = 0)")]
                            get=|f| tokens::token(&tokens::SURFACE, f.choices.surface)
                            set=|f, v| f.choices.surface = if v == "outer" { Surface::Outer } else { Surface::Inner }/>
                    })}
                    <SourceFields form=form place=Place::Point/>
                    {(!thin).then(|| view! { <SectionSketch form=form shown=shown/> })}
                    {(k == SectionKind::Tube).then(|| view! {
                        <div class="buttons">
                            <button type="button" id="to-outer" on:click=move |_| form.update(|f| to_surface(f, true))>"Outer surface"</button>
                            <button type="button" id="to-bore" on:click=move |_| form.update(|f| to_surface(f, false))>"Bore"</button>
                        </div>
                    })}
                    <p class="hint">{match k {
                        SectionKind::Rectangle => "Section axes: x along the member, depth h along y, width b along z. Stresses are given in point axes: x along the member, y along the perimeter (turning from +y towards +z), z into the section.",
                        SectionKind::ThinCylinder | SectionKind::ThinSphere => "Point axes: x axial, y hoop, z radial. Thin-wall theory: σr runs from −p at the inner surface to 0 at the outer.",
                        _ => "Section axes: x along the member, y and z in the section; φ turns from +y towards +z. Stresses are given in point axes: x along the member, y along the hoop (direction of increasing φ), z towards the axis.",
                    }}</p>
                    <ul class="warnings" id="section-warnings">
                        {move || warnings.get().into_iter().map(|w| view! { <li>{w}</li> }).collect_view()}
                    </ul>
                </fieldset>
            }
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn surface_buttons_set_the_radius_from_core() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Section;
        f.choices.kind = SectionKind::Tube;
        to_surface(&mut f, false);
        assert_eq!(f.text(Field::Src(Num::R)), "14"); // Di = 28 mm
        to_surface(&mut f, true);
        assert_eq!(f.text(Field::Src(Num::R)), "20");
    }
}
