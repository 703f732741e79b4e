//! The result groups of the stress's source (the rosette reduction, the section and its
//! critical points) and the strain state by Hooke's law, built with the rows of [`super`].

use super::{location_text, num, principal_angle, text, Group};
use crate::model::evaluation::Evaluation;
use crate::model::numfmt::{format_sig, RESULT_DIGITS};
use crate::model::source::Outcome;

const RESIDUAL_KEYS: [&str; 8] = [
    "residual1",
    "residual2",
    "residual3",
    "residual4",
    "residual5",
    "residual6",
    "residual7",
    "residual8",
];

/// The groups a source path adds: the rosette reduction, or the section and its critical points.
pub(super) fn source_groups(e: &Evaluation) -> Vec<Group> {
    let u = e.unit.symbol();
    let c = &e.choices;
    let su = c.strain_unit;
    let k = 1.0 / su.factor();
    match &e.outcome {
        None => vec![],
        Some(Outcome::Rosette(r)) => {
            let s = &r.strain;
            let mut rows = vec![
                num("ros_ex", "εx", s.ex * k, su.symbol()),
                num("ros_ey", "εy", s.ey * k, su.symbol()),
                num("ros_gxy", "γxy (engineering)", s.gxy * k, su.symbol()),
                num(
                    "ros_e1",
                    "ε1, larger in-plane principal strain",
                    s.principal[0] * k,
                    su.symbol(),
                ),
                num(
                    "ros_e2",
                    "ε2, smaller in-plane principal strain",
                    s.principal[1] * k,
                    su.symbol(),
                ),
                principal_angle(
                    "ros_theta_p",
                    "θp, x to the ε1 direction",
                    s.theta_p,
                    s.isotropic,
                    e.angle_unit,
                ),
                num(
                    "ros_gmax",
                    "γmax in-plane = ε1 − ε2",
                    s.gamma_max * k,
                    su.symbol(),
                ),
            ];
            if r.gauges.len() > 3 {
                for (i, res) in s.residuals.iter().enumerate().take(8) {
                    rows.push(num(
                        RESIDUAL_KEYS[i],
                        format!("gauge {} residual (reading − fit)", i + 1),
                        res * k,
                        su.symbol(),
                    ));
                }
            }
            vec![Group {
                title: "Rosette reduction",
                rows,
            }]
        }
        Some(Outcome::Strain(_)) => vec![],
        Some(Outcome::Section(s)) => {
            let mut rows = Vec::new();
            let lu = c.length;
            if let Some(p) = &s.properties {
                let (l2, l4) = (lu.metres().powi(2), lu.metres().powi(4));
                let sym = lu.symbol();
                rows.push(num("sec_area", "area A", p.area / l2, &format!("{sym}²")));
                rows.push(num(
                    "sec_iy",
                    "second moment Iy",
                    p.iy / l4,
                    &format!("{sym}⁴"),
                ));
                rows.push(num(
                    "sec_iz",
                    "second moment Iz",
                    p.iz / l4,
                    &format!("{sym}⁴"),
                ));
                rows.push(num(
                    "sec_jt",
                    "torsion constant Jt",
                    p.jt / l4,
                    &format!("{sym}⁴"),
                ));
            }
            if let Some(scan) = &s.scan {
                for (key, at_key, label, crit) in [
                    (
                        "scan_max_vm",
                        "scan_max_vm_at",
                        "highest von Mises on the section",
                        &scan.max_von_mises,
                    ),
                    (
                        "scan_max_s1",
                        "scan_max_s1_at",
                        "highest principal stress σ1 on the section",
                        &scan.max_principal,
                    ),
                ] {
                    rows.push(num(key, label, crit.value, u));
                    rows.push(text(
                        at_key,
                        "  at",
                        location_text(crit.at, lu, e.angle_unit),
                    ));
                }
            }
            if let Some(g) = &e.governing {
                let j = &e.judgement;
                let factor_text = |n: Option<f64>| {
                    n.map_or_else(
                        || "∞ (unloaded)".to_string(),
                        |n| format_sig(n, RESULT_DIGITS),
                    )
                };
                if let Some((at, n)) = &g.static_point {
                    let mut r = text(
                        "gov_static",
                        format!("lowest static factor on the section ({})", j.in_use.name()),
                        factor_text(*n),
                    );
                    r.raw = n.map(|n| format!("{n:e}"));
                    rows.push(r);
                    rows.push(text(
                        "gov_static_at",
                        "  at",
                        location_text(at.at, lu, e.angle_unit),
                    ));
                }
                if let (Some((at, n)), Some(f)) = (&g.fatigue_point, &j.fatigue) {
                    let mut r = text(
                        "gov_fatigue",
                        format!("lowest fatigue factor on the section ({})", f.in_use.name()),
                        factor_text(*n),
                    );
                    r.raw = n.map(|n| format!("{n:e}"));
                    rows.push(r);
                    rows.push(text(
                        "gov_fatigue_at",
                        "  at",
                        location_text(at.at, lu, e.angle_unit),
                    ));
                }
                if let Some(note) = g.fatigue_note {
                    rows.push(text("gov_note", "note", note.to_string()));
                }
            }
            if let Some([outer, inner]) = s.vessel_surfaces {
                rows.push(num("vm_outer", "von Mises at the outer surface", outer, u));
                rows.push(num(
                    "vm_inner",
                    "von Mises at the inner surface (σr = −p)",
                    inner,
                    u,
                ));
            }
            for (i, w) in s.warnings.iter().enumerate() {
                rows.push(text(
                    if i == 0 {
                        "section_warning"
                    } else {
                        "section_warning2"
                    },
                    "caution",
                    (*w).to_string(),
                ));
            }
            vec![Group {
                title: "Section and its critical points",
                rows,
            }]
        }
    }
}

/// The strain of the stress state by Hooke's law.
pub(super) fn strain_group(e: &Evaluation) -> Group {
    let su = e.choices.strain_unit;
    let k = 1.0 / su.factor();
    let s = &e.strain;
    let sym = su.symbol();
    let mut rows = vec![
        num("eps_x", "εx", s.ex * k, sym),
        num("eps_y", "εy", s.ey * k, sym),
        num("eps_z", "εz", s.ez * k, sym),
        num("gam_xy", "γxy (engineering)", s.gxy * k, sym),
        num("gam_yz", "γyz", s.gyz * k, sym),
        num("gam_zx", "γzx", s.gzx * k, sym),
    ];
    if let Ok([e1, e2, e3]) = s.principal() {
        rows.push(num("eps_1", "ε1", e1 * k, sym));
        rows.push(num("eps_2", "ε2", e2 * k, sym));
        rows.push(num("eps_3", "ε3", e3 * k, sym));
    }
    Group {
        title: "Strain at the point (Hooke's law, with E, ν, α·ΔT)",
        rows,
    }
}
