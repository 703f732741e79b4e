//! "Results": every number core gives for the case, grouped, each with its unit. Each value cell
//! carries `data-key` and the unrounded `data-value` (in the case's unit) for tests and copying.

use crate::model::case::Mode;
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::{format_decimal_power, format_sig, RESULT_DIGITS};
use leptos::prelude::*;
use nalgebra::Vector3;
use stresscase_core::invariants::Magnitude;
use stresscase_core::section::{Face, Location};
use stresscase_core::units::LengthUnit;
use stresscase_core::AngleUnit;

mod source_rows;

use source_rows::{source_groups, strain_group};

/// One line of a result table.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// Stable key for tests, e.g. `sigma1`.
    pub key: &'static str,
    /// What it is.
    pub label: String,
    /// The unrounded number in the case's unit, where the row is one number.
    pub value: Option<f64>,
    /// The text shown, unit included.
    pub text: String,
    /// The exact value as text where it is not an f64 (beyond double range, e.g. `6e450`).
    pub raw: Option<String>,
    /// The unit of `value` ("" for a dimensionless number or a text row).
    pub unit: String,
}

/// A titled group of rows.
#[derive(Debug, Clone, PartialEq)]
pub struct Group {
    /// Heading.
    pub title: &'static str,
    /// Rows.
    pub rows: Vec<Row>,
}

fn num(key: &'static str, label: impl Into<String>, v: f64, unit: &str) -> Row {
    let text = if unit.is_empty() {
        format_sig(v, RESULT_DIGITS)
    } else {
        format!("{} {unit}", format_sig(v, RESULT_DIGITS))
    };
    Row {
        key,
        label: label.into(),
        value: Some(v),
        text,
        raw: None,
        unit: unit.to_string(),
    }
}

/// A value that may lie beyond double range: shown as m × 10ⁿ with a note, never 0 or ∞.
fn magnitude(key: &'static str, label: &str, m: Magnitude, unit: &str) -> Row {
    match m {
        Magnitude::Finite(v) => num(key, label, v, unit),
        Magnitude::OutOfRange {
            mantissa,
            exponent,
            overflow,
        } => Row {
            key,
            label: label.into(),
            value: None,
            text: format!(
                "{} {unit} ({} double range: shown as computed on the scaled tensor)",
                format_decimal_power(mantissa, exponent, RESULT_DIGITS),
                if overflow { "above" } else { "below" }
            ),
            raw: Some(format!("{mantissa}e{exponent}")),
            unit: unit.to_string(),
        },
    }
}

fn angle(key: &'static str, label: impl Into<String>, radians: f64, unit: AngleUnit) -> Row {
    let v = unit.from_radians(radians);
    let text = match unit {
        AngleUnit::Degree => format!("{}°", format_sig(v, RESULT_DIGITS)),
        AngleUnit::Radian => format!("{} rad", format_sig(v, RESULT_DIGITS)),
    };
    Row {
        key,
        label: label.into(),
        value: Some(v),
        text,
        raw: None,
        unit: match unit {
            AngleUnit::Degree => "°".into(),
            AngleUnit::Radian => "rad".into(),
        },
    }
}

fn text(key: &'static str, label: impl Into<String>, t: String) -> Row {
    Row {
        key,
        label: label.into(),
        value: None,
        text: t,
        raw: None,
        unit: String::new(),
    }
}

/// An in-plane principal angle, or "any direction" when the in-plane state is isotropic.
fn principal_angle(
    key: &'static str,
    label: &str,
    radians: f64,
    isotropic: bool,
    unit: AngleUnit,
) -> Row {
    if isotropic {
        let mut r = text(
            key,
            label,
            "any direction (isotropic in the plane: every direction is principal)".into(),
        );
        r.raw = Some("any".into());
        r
    } else {
        angle(key, label, radians, unit)
    }
}

fn vector(v: &Vector3<f64>) -> String {
    format!(
        "({}, {}, {})",
        format_sig(v.x, 4),
        format_sig(v.y, 4),
        format_sig(v.z, 4)
    )
}

/// All result groups for an evaluation.
#[must_use]
pub fn groups(e: &Evaluation) -> Vec<Group> {
    let u = e.unit.symbol();
    let au = e.angle_unit;
    let u2 = format!("{u}²");
    let u3 = format!("{u}³");
    let [s1, s2, s3] = e.principal.values();
    let [n1, n2, n3] = e.principal.directions();
    let ip = &e.in_plane;
    let m = &e.mohr3d;
    let [tn1, tn2] = m.tau_max_normals();
    let inv = &e.invariants;
    let eq = &e.equivalent;
    let r = &e.rotated;
    let d = &e.deviatoric;
    let pr = &e.probe;

    let mut principal = vec![
        num("sigma1", "σ1", s1, u),
        num("sigma2", "σ2", s2, u),
        num("sigma3", "σ3", s3, u),
        text(
            "n1",
            "direction n1 of σ1 (unit vector in x, y, z)",
            vector(&n1),
        ),
        text(
            "n2",
            "direction n2 of σ2 (unit vector in x, y, z)",
            vector(&n2),
        ),
        text(
            "n3",
            "direction n3 of σ3 (unit vector in x, y, z)",
            vector(&n3),
        ),
    ];
    let in_plane_title = if e.mode == Mode::Plane {
        "in-plane"
    } else {
        "x–y plane (turns about z)"
    };
    principal.push(num(
        "sigma_a",
        format!("σI, larger {in_plane_title}"),
        ip.sigma_a,
        u,
    ));
    principal.push(num(
        "sigma_b",
        format!("σII, smaller {in_plane_title}"),
        ip.sigma_b,
        u,
    ));
    principal.push(principal_angle(
        "theta_p",
        "θp, x to the σI face",
        ip.theta_p,
        ip.isotropic,
        au,
    ));

    let mut shear = vec![
        num(
            "tau_max",
            "absolute max shear τmax = (σ1 − σ3)/2",
            m.tau_max(),
            u,
        ),
        text(
            "tau_max_planes",
            "its plane normals (n1 ± n3)/√2",
            format!("{} and {}", vector(&tn1), vector(&tn2)),
        ),
        num(
            "tau_max_sigma",
            "normal stress on those planes",
            m.c13.centre,
            u,
        ),
        num(
            "tau_in_plane",
            format!("max {in_plane_title} shear"),
            ip.radius,
            u,
        ),
        principal_angle(
            "theta_s",
            "θs, x to the face with τx′y′ = +max",
            ip.theta_s,
            ip.isotropic,
            au,
        ),
    ];
    if e.out_of_plane_governs {
        shear.push(text(
            "out_of_plane_warning",
            "note",
            format!(
                "τmax acts out of the x–y plane and exceeds the in-plane maximum ({} vs {} {u}): σz = 0 is the {} principal stress.",
                format_sig(m.tau_max(), 4),
                format_sig(ip.radius, 4),
                if s3 >= 0.0 { "smallest" } else { "largest" }
            ),
        ));
    }

    let mut turned = vec![
        num("sx_t", "σx′", r.sx(), u),
        num("sy_t", "σy′", r.sy(), u),
        num("txy_t", "τx′y′", r.txy(), u),
    ];
    if e.mode == Mode::Full {
        turned.push(num("sz_t", "σz", r.sz(), u));
        turned.push(num("tzx_t", "τx′z", r.tzx(), u));
        turned.push(num("tyz_t", "τy′z", r.tyz(), u));
    }

    let none = || "undefined (hydrostatic state)".to_string();
    let equivalent = vec![
        num("von_mises", "von Mises σvm", eq.von_mises, u),
        num("tresca", "Tresca intensity σ1 − σ3", eq.tresca, u),
        num(
            "oct_normal",
            "octahedral normal σoct",
            eq.octahedral_normal,
            u,
        ),
        num("oct_shear", "octahedral shear τoct", eq.octahedral_shear, u),
        match eq.triaxiality {
            Some(t) => num("triaxiality", "triaxiality η = σh/σvm", t, ""),
            None => text("triaxiality", "triaxiality η = σh/σvm", none()),
        },
        match eq.lode_angle {
            Some(a) => angle("lode", "Lode angle θL", a, au),
            None => text("lode", "Lode angle θL", none()),
        },
    ];

    let invariants = vec![
        num("i1", "I1", inv.i1, u),
        magnitude("i2", "I2", e.magnitudes.i2, &u2),
        magnitude("i3", "I3", e.magnitudes.i3, &u3),
        magnitude("j2", "J2", e.magnitudes.j2, &u2),
        magnitude("j3", "J3", e.magnitudes.j3, &u3),
        num("mean", "hydrostatic (mean) stress σh = I1/3", inv.mean, u),
        text(
            "deviatoric",
            "deviator sx, sy, sz, sxy, syz, szx",
            format!(
                "{}, {}, {}, {}, {}, {} {u}",
                format_sig(d.sx(), 4),
                format_sig(d.sy(), 4),
                format_sig(d.sz(), 4),
                format_sig(d.txy(), 4),
                format_sig(d.tyz(), 4),
                format_sig(d.tzx(), 4)
            ),
        ),
    ];

    let probe = vec![
        text("probe_n", "unit normal n", vector(&pr.normal_vector)),
        text(
            "probe_t",
            format!("traction t = σ·n ({u})"),
            vector(&pr.traction),
        ),
        num("probe_sigma", "normal stress σn", pr.normal, u),
        num("probe_tau", "shear stress |τn|", pr.shear, u),
        text(
            "probe_dir",
            "shear direction",
            pr.shear_direction
                .map_or_else(|| "none (principal plane)".into(), |v| vector(&v)),
        ),
    ];

    let mut all = source_groups(e);
    all.extend([
        Group {
            title: "Principal stresses",
            rows: principal,
        },
        Group {
            title: "Shear",
            rows: shear,
        },
        Group {
            title: "Element turned by θ",
            rows: turned,
        },
        Group {
            title: "Equivalent stresses",
            rows: equivalent,
        },
        Group {
            title: "Invariants",
            rows: invariants,
        },
        Group {
            title: "Plane by its normal",
            rows: probe,
        },
        strain_group(e),
    ]);
    all
}

/// Where a location is, in words (its lengths already in `length`).
#[must_use]
pub fn location_text(at: Location, length: LengthUnit, au: AngleUnit) -> String {
    let l = length.symbol();
    match at {
        Location::Round { phi, r } => {
            let v = au.from_radians(phi);
            let a = match au {
                AngleUnit::Degree => format!("{}°", format_sig(v, 4)),
                AngleUnit::Radian => format!("{} rad", format_sig(v, 4)),
            };
            format!("φ = {a}, r = {} {l}", format_sig(r, 4))
        }
        Location::Rectangle { face, along } => {
            let (name, coord) = match face {
                Face::PosY => ("+y", "z"),
                Face::NegY => ("−y", "z"),
                Face::PosZ => ("+z", "y"),
                Face::NegZ => ("−z", "y"),
            };
            format!("face {name}, {coord} = {} {l}", format_sig(along, 4))
        }
    }
}

/// The results as CSV: a comment line with the case link, a header, then one record per
/// result: quantity, value (unrounded, or the text shown for a text row), unit, key.
#[must_use]
pub fn csv(e: &Evaluation, link: &str) -> String {
    let mut w = csv::Writer::from_writer(Vec::new());
    let mut record = |fields: [&str; 4]| {
        let _ = w.write_record(fields);
    };
    record(["quantity", "value", "unit", "key"]);
    for g in groups(e) {
        for r in g.rows {
            let label = format!("{}: {}", g.title, r.label.trim());
            let value = r
                .raw
                .clone()
                .or_else(|| r.value.map(|v| v.to_string()))
                .unwrap_or_else(|| r.text.clone());
            record([&label, &value, &r.unit, r.key]);
        }
    }
    let body = w
        .into_inner()
        .map(|b| String::from_utf8_lossy(&b).into_owned())
        .unwrap_or_default();
    format!("# Stresscase results; case link: {link}\n{body}")
}

/// The results tables.
#[component]
pub fn ResultsPanel(shown: Memo<Option<Evaluation>>, stale: Memo<bool>) -> impl IntoView {
    let content = move || {
        shown.with(|s| {
            s.as_ref().map(|e| {
                groups(e)
                    .into_iter()
                    .map(|g| {
                        let rows = g
                            .rows
                            .into_iter()
                            .map(|r| {
                                let raw = r.raw.clone().or_else(|| r.value.map(|v| format!("{v:e}"))).unwrap_or_default();
                                view! {
                                    <tr>
                                        <th scope="row">{r.label}</th>
                                        <td class=if r.value.is_some() { "num" } else { "txt" } data-key=r.key data-value=raw>{r.text}</td>
                                    </tr>
                                }
                            })
                            .collect_view();
                        view! {
                            <table class="result-group">
                                <caption>{g.title}</caption>
                                <tbody>{rows}</tbody>
                            </table>
                        }
                    })
                    .collect_view()
            })
        })
    };
    let mismatch = move || shown.with(|e| e.as_ref().and_then(|e| e.elastic.mismatch.clone()));
    let status = RwSignal::new(String::new());
    let save_csv = move |_| {
        let text = shown.with_untracked(|e| {
            e.as_ref().map(|e| {
                csv(
                    e,
                    &crate::edge::browser::url_with(&crate::edge::browser::hash()),
                )
            })
        });
        if let Some(text) = text {
            let r = crate::edge::browser::download_as("stresscase-results.csv", &text, "text/csv");
            status.set(
                r.err()
                    .map(|e| format!("Not saved: {e}."))
                    .unwrap_or_default(),
            );
        }
    };
    view! {
        <section class="panel results" id="panel-results" class:stale=move || stale.get()>
            <h2>"Results" {move || stale.get().then_some(" — stale, last valid input")}</h2>
            {move || mismatch().map(|m| view! { <p class="warnings mismatch" id="elastic-mismatch" role="note"><strong>"E and ν: "</strong>{m}</p> })}
            <div class="buttons export-row">
                <button type="button" id="export-csv" on:click=save_csv>"Save results as CSV"</button>
                <span class="status" role="status">{move || status.get()}</span>
            </div>
            <div class="result-grid">{content}</div>
        </section>
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::{CaseForm, Field};

    #[test]
    fn every_number_has_a_unit_or_is_dimensionless_by_design() {
        let e = CaseForm::demo().evaluate().unwrap();
        for g in groups(&e) {
            for r in g.rows {
                if r.value.is_some() && r.key != "triaxiality" {
                    assert!(
                        r.text.contains("MPa") || r.text.ends_with('°') || r.text.ends_with("µε"),
                        "{} has no unit: {}",
                        r.key,
                        r.text
                    );
                }
            }
        }
    }

    #[test]
    fn the_csv_holds_every_result_with_its_unit_and_the_link() {
        let e = CaseForm::demo().evaluate().unwrap();
        let text = csv(&e, "http://x.invalid/#v=1&a=b,c");
        let mut lines = text.lines();
        assert_eq!(
            lines.next(),
            Some("# Stresscase results; case link: http://x.invalid/#v=1&a=b,c")
        );
        let body: String = lines.collect::<Vec<_>>().join("\n");
        let mut r = ::csv::Reader::from_reader(body.as_bytes());
        let rows: Vec<_> = r.records().map(Result::unwrap).collect();
        let s1 = rows.iter().find(|r| &r[3] == "sigma1").unwrap();
        assert_eq!(s1[1].parse::<f64>().unwrap(), e.principal.sigma1());
        assert_eq!(&s1[2], "MPa");
        let n = groups(&e).iter().map(|g| g.rows.len()).sum::<usize>();
        assert_eq!(rows.len(), n);
    }

    #[test]
    fn equal_biaxial_warns_about_out_of_plane_shear() {
        let mut f = CaseForm::demo();
        f.set_text(Field::Sx, "50".into());
        f.set_text(Field::Sy, "50".into());
        f.set_text(Field::Txy, "0".into());
        let e = f.evaluate().unwrap();
        let keys: Vec<_> = groups(&e)
            .into_iter()
            .flat_map(|g| g.rows)
            .map(|r| r.key)
            .collect();
        assert!(keys.contains(&"out_of_plane_warning"));
    }
}
