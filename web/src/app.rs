//! The whole page: the case signal, the evaluation memos, and the panels laid out.

use crate::edge::browser::{self, CURRENT_KEY};
use crate::edge::history::{HistoryAction, HistoryPolicy};
use crate::formats::link::Case;
use crate::model::case::CaseForm;
use crate::model::evaluation::Evaluation;
use crate::panels::{
    calc_sheet::{SheetHead, SheetTail},
    case_shelf::CaseShelf,
    caution::CautionNote,
    elastic_entry::ElasticEntry,
    element_turn::ElementTurn,
    fatigue_check::FatigueCheck,
    headline::Headline,
    life_check::LifeCheck,
    link_notice::LinkNotice,
    mohr_diagram::{MohrDiagram, NarrowScreen},
    number_field::SharedResult,
    plane_probe::PlaneProbe,
    results::ResultsPanel,
    rosette_entry::RosetteEntry,
    scan_plot::ScanPlot,
    section_loads::SectionLoads,
    source_pick::SourcePick,
    stale_notice::StaleNotice,
    strain_circle::StrainCircle,
    strain_entry::StrainEntry,
    stress_element::StressElement,
    stress_entry::StressEntry,
    table_view::TableView,
    verdict::Verdict,
};
use leptos::prelude::*;

/// The case to start with: the link in the URL; if there is none, or it is refused, the case last
/// on screen in this browser; else the demo. Returns the case, a link problem and a storage
/// problem to show.
fn starting_case() -> (Case, Option<String>, Option<String>) {
    let (stored, storage_problem) = match browser::load(CURRENT_KEY) {
        Ok(v) => (v.and_then(|l| Case::from_link(&l).ok()), None),
        Err(e) => (None, Some(e)),
    };
    let fallback = || stored.clone().unwrap_or_else(Case::demo);
    let hash = browser::hash();
    // The page was reloaded (or left and come back to) before the address bar caught up with
    // the last edit: that edit, made from this very fragment, is the case on screen.
    let unwritten =
        browser::session_take(browser::UNWRITTEN_KEY).and_then(|kept| unwritten_edit(&kept, &hash));
    if let Some(case) = unwritten {
        return (case, None, storage_problem);
    }
    if hash.is_empty() {
        return (fallback(), None, storage_problem);
    }
    match Case::from_link(&hash) {
        Ok(c) => (c, None, storage_problem),
        Err(e) => (fallback(), Some(e.to_string()), storage_problem),
    }
}

/// The case of an edit kept by the page before it was left (`kept`: fragment, newline, link),
/// when the page has come back to the fragment that edit was made from.
fn unwritten_edit(kept: &str, hash: &str) -> Option<Case> {
    let (from, link) = kept.split_once('\n')?;
    if from != hash {
        return None;
    }
    Case::from_link(link).ok()
}

/// How long typing must pause before the case goes to the URL and to local storage.
const LINK_PAUSE: std::time::Duration = std::time::Duration::from_millis(250);

/// The root component.
#[component]
pub fn App() -> impl IntoView {
    let (start, link_problem, storage_problem) = starting_case();
    let link_problem = RwSignal::new(link_problem);
    let storage_problem = RwSignal::new(storage_problem);
    let start_link = start.to_link();
    browser::set_hash(&start_link, false);
    // The case on screen is the one a reload or restart brings back, also before any edit.
    let storage_problem_now = browser::store(CURRENT_KEY, &start_link).err();
    if storage_problem.get_untracked().is_none() {
        storage_problem.set(storage_problem_now);
    }
    let policy = StoredValue::new(HistoryPolicy::new(start_link));
    let form = RwSignal::new(start.to_form());

    // Talk to the outside: every valid case goes to the URL (a new history entry when an edit
    // starts after a pause) and to local storage. Writing them costs the browser milliseconds,
    // so it waits until typing pauses, and is done at once when the page is hidden or left.
    let pending = StoredValue::new(None::<TimeoutHandle>);
    let write_out = move |edited_at: f64| {
        pending.set_value(None);
        let Ok(case) = form.with_untracked(Case::from_form) else {
            return;
        };
        let link = case.to_link();
        let mut action = HistoryAction::Nothing;
        policy.update_value(|p| action = p.on_edit(edited_at, &link));
        match action {
            HistoryAction::Nothing => return,
            HistoryAction::Push => browser::set_hash(&link, true),
            HistoryAction::Replace => browser::set_hash(&link, false),
        }
        if let Err(e) = browser::store(CURRENT_KEY, &link) {
            storage_problem.set(Some(e));
        }
    };
    Effect::new(move |_| {
        form.track();
        let edited_at = browser::now_ms();
        if let Some(h) = pending.get_value() {
            h.clear();
        }
        pending.set_value(set_timeout_with_handle(move || write_out(edited_at), LINK_PAUSE).ok());
    });
    // Leaving the page: a reload keeps the address it had, so an edit still waiting is also
    // kept for this tab, with the fragment it was made from (see `starting_case`).
    let flush = move |leaving: bool| {
        if let Some(h) = pending.get_value() {
            h.clear();
            let from = browser::hash();
            write_out(browser::now_ms());
            if let (true, Ok(case)) = (leaving, form.with_untracked(Case::from_form)) {
                let link = case.to_link();
                if link != from {
                    browser::session_put(browser::UNWRITTEN_KEY, &format!("{from}\n{link}"));
                }
            }
        }
    };
    let _ = window_event_listener(leptos::ev::pagehide, move |_| flush(true));
    let _ = window_event_listener(leptos::ev::visibilitychange, move |_| flush(false));

    // Back, forward, or a link pasted into the address bar.
    let navigated = move || {
        let hash = browser::hash();
        if policy.with_value(|p| p.current() == hash) {
            return;
        }
        match Case::from_link(&hash) {
            Ok(case) => {
                let link = case.to_link();
                if link != hash {
                    browser::set_hash(&link, false);
                }
                policy.update_value(|p| p.on_navigate(&link));
                link_problem.set(None);
                form.set(case.to_form());
            }
            Err(e) => {
                link_problem.set(Some(e.to_string()));
                browser::set_hash(&policy.with_value(|p| p.current().to_string()), false);
            }
        }
    };
    // The page lives as long as the tab, so the listeners are never removed.
    let _ = window_event_listener(leptos::ev::popstate, move |_| navigated());
    let _ = window_event_listener(leptos::ev::hashchange, move |_| navigated());
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
    provide_context::<SharedResult>(result);
    provide_context(crate::panels::shared_case::SharedCase::new(form));
    // The table's load history, shared by the table view (which makes it) and the life panel.
    provide_context(RwSignal::new(
        None::<std::sync::Arc<crate::model::table::history::TableHistory>>,
    ));
    // Phones get drawings made for their width; follow the window as it turns or resizes.
    let narrow = RwSignal::new(browser::is_narrow());
    provide_context(NarrowScreen(narrow));
    let _ = window_event_listener(leptos::ev::resize, move |_| {
        let now = browser::is_narrow();
        if narrow.get_untracked() != now {
            narrow.set(now);
        }
    });

    // The answer, the inputs and the decision are drawn first; what lies below them (the
    // results table, the table view, the conventions and the printed sheet's end) follows once
    // that first frame has been painted, or at once if printing starts first.
    let rest = RwSignal::new(false);
    request_animation_frame(move || {
        set_timeout(move || rest.set(true), std::time::Duration::ZERO);
    });
    let _ = window_event_listener_untyped("beforeprint", move |_| rest.set(true));

    view! {
        // The masthead is static in index.html, painted before this code has arrived.
        <SheetHead form=form shown=shown/>
        <Headline shown=shown stale=stale on_print=browser::print/>
        <CautionNote/>
        <LinkNotice problem=link_problem/>
        <StaleNotice form=form result=result shown=shown/>
        // The answer leads: the three-circle diagram first, the case beside it.
        <main class="bench">
            <div class="pictures answer" class:stale=move || stale.get()>
                <MohrDiagram form=form shown=shown stale=stale/>
            </div>
            <div class="inputs">
                <SourcePick form=form shown=shown/>
                <SectionLoads form=form shown=shown stale=stale/>
                <RosetteEntry form=form shown=shown stale=stale/>
                <StrainEntry form=form shown=shown stale=stale/>
                <StressEntry form=form shown=shown/>
                <ElasticEntry form=form shown=shown stale=stale/>
                <ElementTurn form=form shown=shown/>
                <PlaneProbe form=form shown=shown/>
                <CaseShelf form=form storage_problem=storage_problem/>
            </div>
            <div class="pictures more" class:stale=move || stale.get()>
                <ScanPlot form=form shown=shown stale=stale/>
                <div class="picture-pair">
                    <StressElement shown=shown stale=stale/>
                    <StrainCircle shown=shown stale=stale/>
                </div>
            </div>
        </main>
        <div class="decision" class:stale=move || stale.get()>
            <Verdict form=form shown=shown stale=stale/>
            <FatigueCheck form=form shown=shown stale=stale/>
            <LifeCheck form=form shown=shown stale=stale/>
        </div>
        <Show when=move || rest.get()>
            <ResultsPanel shown=shown stale=stale/>
            <TableView form=form shown=shown/>
            <Conventions/>
            <SheetTail form=form shown=shown/>
        </Show>
    }
}

/// The sign conventions and symbols, at the foot of the page.
#[component]
fn Conventions() -> impl IntoView {
    view! {
        <footer class="conventions" id="conventions">
            <h2>"Conventions"</h2>
            <ul>
                <li>"Tension positive. τij acts on the face whose outward normal is +i, in the +j direction; τij = τji."</li>
                <li>"θ turns x′ counter-clockwise from x towards y, about z pointing out of the page."</li>
                <li>"Principal stresses are ordered σ1 ≥ σ2 ≥ σ3; directions are unit vectors in x, y, z."</li>
                <li>"Mohr diagram: a face whose normal is at φ plots at (σn, τnt), t being n turned +90°, so X = (σx, τxy) and Y = (σy, −τxy). The shear axis direction is chosen above the diagram and written on it."</li>
                <li>"Sections: x along the member; loads act on the +x face, positive by the right-hand rule. Stresses at a section point are in point axes: x along the member, y along the perimeter, z into the section."</li>
                <li>"Strains: engineering shear γ = 2ε; rosette gauge angles counter-clockwise from x."</li>
                <li>"Lode angle θL from cos 3θL = 3√3·J3 / (2·J2^1.5): 0° uniaxial tension, 30° pure shear, 60° uniaxial compression."</li>
            </ul>
            <h3 id="glossary">"Symbols"</h3>
            <dl class="glossary">
                <dt>"σ1 ≥ σ2 ≥ σ3"</dt><dd>"principal stresses of the full 3D state"</dd>
                <dt>"σI ≥ σII"</dt><dd>"in-plane principal stresses (faces turned about z); σI–σII is the plane of the failure envelopes"</dd>
                <dt>"σx′, σy′, τx′y′"</dt><dd>"stresses on the element turned by θ"</dd>
                <dt>"σh = I1/3"</dt><dd>"hydrostatic (mean) stress of the state"</dd>
                <dt>"σvm"</dt><dd>"von Mises equivalent stress"</dd>
                <dt>"σa,eq, σm,eq"</dt><dd>"fatigue: von Mises equivalents of the cycle's alternating and mean parts (σm,eq signed by I1)"</dd>
                <dt>"σn, τn"</dt><dd>"normal and shear stress on the plane given by its normal n"</dd>
                <dt>"τmax"</dt><dd>"absolute maximum shear (σ1 − σ3)/2"</dd>
                <dt>"n"</dt><dd>"factor of safety: the factor every load can grow by before the envelope is reached"</dd>
                <dt>"Sy, Sut, Suc, Se"</dt><dd>"yield, ultimate tensile, ultimate compressive strength, endurance limit"</dd>
                <dt>"E, ν, α"</dt><dd>"Young's modulus, Poisson's ratio, coefficient of thermal expansion"</dd>
            </dl>
        </footer>
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn an_unwritten_edit_comes_back_only_to_the_fragment_it_was_made_from() {
        let from = Case::demo().to_link();
        let mut edited = Case::demo();
        edited.stress[0] = 140.0;
        let kept = format!("{from}\n{}", edited.to_link());
        assert_eq!(unwritten_edit(&kept, &from), Some(edited));
        // Another link pasted, or a new tab: the address wins.
        assert_eq!(unwritten_edit(&kept, "v=1&mode=plane"), None);
        assert_eq!(unwritten_edit(&kept, ""), None);
        // A damaged record is ignored.
        assert_eq!(unwritten_edit(&from, &from), None);
        assert_eq!(unwritten_edit(&format!("{from}\nv=9"), &from), None);
    }
}
