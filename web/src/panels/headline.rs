//! The headline: the answer first, always in view at the top of the page — σ1, σ2, σ3, the
//! absolute maximum shear, von Mises, the static factor of safety of the criterion in use with
//! pass or fail, and the fatigue factor when fatigue is on. Each figure is an element with
//! `data-key` and the unrounded `data-value` in the unit shown.

use crate::model::evaluation::Evaluation;
use crate::model::numfmt::format_sig;
use crate::panels::stale_notice::StaleBadge;
use leptos::prelude::*;

/// One figure of the headline.
#[derive(Debug, Clone, PartialEq)]
pub struct Figure {
    /// Stable key: `sigma1`, `sigma2`, `sigma3`, `tau_abs_max`, `von_mises`, `n_static`,
    /// `n_fatigue`.
    pub key: &'static str,
    /// The symbol shown.
    pub symbol: String,
    /// The value in the unit shown (`inf` for an unloaded factor).
    pub value: f64,
    /// The text shown, unit included.
    pub text: String,
    /// For a factor of safety: whether it meets the required one.
    pub passes: Option<bool>,
}

/// The headline's figures for an evaluation.
#[must_use]
pub fn figures(e: &Evaluation) -> Vec<Figure> {
    let u = e.unit.symbol();
    let [s1, s2, s3] = e.principal.values();
    let stress = |key, symbol: &str, v: f64| Figure {
        key,
        symbol: symbol.into(),
        value: v,
        text: format!("{} {u}", format_sig(v, 4)),
        passes: None,
    };
    let mut v = vec![
        stress("sigma1", "σ1", s1),
        stress("sigma2", "σ2", s2),
        stress("sigma3", "σ3", s3),
        stress("tau_abs_max", "τmax", e.mohr3d.tau_max()),
        stress("von_mises", "σvm", e.equivalent.von_mises),
    ];
    let j = &e.judgement;
    let factor = |key, symbol: String, n: Option<f64>| {
        let passes = n.is_none_or(|n| n >= j.required);
        Figure {
            key,
            symbol,
            value: n.unwrap_or(f64::INFINITY),
            text: format!(
                "{} {} {}",
                n.map_or_else(|| "∞".to_string(), |n| format_sig(n, 3)),
                if passes { "≥" } else { "<" },
                format_sig(j.required, 3)
            ),
            passes: Some(passes),
        }
    };
    if let Some(verdict) = j.in_use_verdict() {
        v.push(factor(
            "n_static",
            format!("n static, {}", short(j.in_use.name())),
            verdict.factor,
        ));
    }
    if let Some(f) = &j.fatigue {
        v.push(factor(
            "n_fatigue",
            format!("n fatigue, {}", f.in_use.name()),
            f.factor_in_use(),
        ));
    }
    v
}

/// A criterion's name without its parenthesis: "von Mises (distortion energy)" → "von Mises".
fn short(name: &str) -> &str {
    name.split(" (").next().unwrap_or(name)
}

/// The strip.
#[component]
pub fn Headline(
    shown: Memo<Option<Evaluation>>,
    stale: Memo<bool>,
    on_print: impl Fn() + 'static,
) -> impl IntoView {
    let items = move || {
        shown.with(|e| {
            e.as_ref().map(|e| {
                figures(e)
                    .into_iter()
                    .map(|f| {
                        let verdict = f.passes.map(|p| if p { "passes" } else { "FAILS" });
                        view! {
                            <div class="figure" class:fails=f.passes == Some(false) class:passes=f.passes == Some(true)>
                                <span class="symbol">{f.symbol}</span>
                                <span class="value" data-key=f.key data-value=format!("{:e}", f.value)>{f.text}</span>
                                {verdict.map(|v| view! { <span class="verdict-word">{v}</span> })}
                            </div>
                        }
                    })
                    .collect_view()
            })
        })
    };
    let none = move || {
        shown
            .with(Option::is_none)
            .then_some(view! { <p class="figure none">"No result yet: fix the marked input."</p> })
    };
    view! {
        <section id="headline" class="headline-strip" class:stale=move || stale.get() aria-label="Headline results">
            <div class="figures">
                {items}{none}
                <StaleBadge stale=stale/>
                <button type="button" id="print-sheet" class="print-button" on:click=move |_| on_print()>"Print calc sheet"</button>
            </div>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::CaseForm;

    #[test]
    fn the_headline_holds_the_answer_with_units() {
        let mut f = CaseForm::demo();
        let e = f.evaluate().unwrap();
        let keys: Vec<_> = figures(&e).iter().map(|f| f.key).collect();
        assert_eq!(
            keys,
            [
                "sigma1",
                "sigma2",
                "sigma3",
                "tau_abs_max",
                "von_mises",
                "n_static"
            ]
        );
        for fig in figures(&e).iter().take(5) {
            assert!(fig.text.ends_with("MPa"), "{}", fig.text);
        }
        assert_eq!(figures(&e)[0].value, e.principal.sigma1());
        f.choices.fatigue = true;
        f.set_text(
            crate::model::case::Field::Src(crate::model::inputs::Num::Ratio),
            "0".into(),
        );
        let e = f.evaluate().unwrap();
        let last = figures(&e).pop().unwrap();
        assert_eq!(last.key, "n_fatigue");
        assert_eq!(
            Some(last.value),
            e.judgement.fatigue.as_ref().unwrap().factor_in_use()
        );
    }
}
