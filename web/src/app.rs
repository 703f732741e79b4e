//! The whole page: the case signal, the evaluation memos, and the panels laid out.

use crate::case::{CaseForm, Evaluation};
use crate::panels::{
    caution::CautionNote, element_turn::ElementTurn, mohr_diagram::MohrDiagram,
    plane_probe::PlaneProbe, results::ResultsPanel, stale_notice::StaleNotice,
    stress_element::StressElement, stress_entry::StressEntry,
};
use leptos::prelude::*;

/// The root component.
#[component]
pub fn App() -> impl IntoView {
    let form = RwSignal::new(CaseForm::demo());
    let result = Memo::new(move |_| form.with(CaseForm::evaluate));
    // The last good evaluation stays on screen while an input is invalid.
    let shown: Memo<Option<Evaluation>> =
        Memo::new(
            move |prev: Option<&Option<Evaluation>>| match result.get() {
                Ok(e) => Some(e),
                Err(_) => prev.cloned().flatten(),
            },
        );
    let stale = Memo::new(move |_| result.with(Result::is_err));

    view! {
        <header class="masthead">
            <h1>"Stresscase"</h1>
            <p class="tagline">"Stress state at one critical point: principal stresses, all three Mohr's circles, the plane that matters."</p>
        </header>
        <CautionNote/>
        <main class="bench">
            <div class="inputs">
                <StressEntry form=form/>
                <ElementTurn form=form shown=shown/>
                <PlaneProbe form=form shown=shown/>
            </div>
            <div class="pictures" class:stale=move || stale.get()>
                <StaleNotice result=result/>
                <MohrDiagram form=form shown=shown/>
                <StressElement shown=shown/>
            </div>
        </main>
        <ResultsPanel shown=shown stale=stale/>
        <footer class="conventions" id="conventions">
            <h2>"Conventions"</h2>
            <ul>
                <li>"Tension positive. τij acts on the face whose outward normal is +i, in the +j direction; τij = τji."</li>
                <li>"θ turns x′ counter-clockwise from x towards y, about z pointing out of the page."</li>
                <li>"Principal stresses are ordered σ1 ≥ σ2 ≥ σ3; directions are unit vectors in x, y, z."</li>
                <li>"Mohr diagram: a face whose normal is at φ plots at (σn, τnt), t being n turned +90°, so X = (σx, τxy) and Y = (σy, −τxy). The shear axis direction is chosen above the diagram and written on it."</li>
                <li>"Lode angle θL from cos 3θL = 3√3·J3 / (2·J2^1.5): 0° uniaxial tension, 30° pure shear, 60° uniaxial compression."</li>
            </ul>
        </footer>
    }
}
