//! Column kinds guessed from header names (`S11 (MPa)`, `σx`, `tau_zx`, `SG1`, `gauge 2`, `C`,
//! `εx`, `gamma_xy`, `Node ID`, `time [s]`, ...); the page shows the guess for the user to
//! correct.

use super::Shape;
use crate::model::table::ColumnKind;

/// The header name with case, spaces, separators and a trailing unit in brackets removed.
fn normalize(name: &str) -> String {
    let cut = name.find(['(', '[']).map_or(name, |i| &name[..i]);
    cut.chars()
        .filter(|c| !matches!(c, ' ' | '_' | '-' | '.' | '"' | '\''))
        .flat_map(char::to_lowercase)
        .collect()
}

/// The trailing gauge number (1-based in the name) of names like `g2`, `gauge 2`, `SG2`,
/// `ch3`, `grid1`, or a rosette grid letter `a`, `b`, `c`.
fn gauge_number(n: &str) -> Option<u8> {
    match n {
        "a" => return Some(0),
        "b" => return Some(1),
        "c" => return Some(2),
        _ => {}
    }
    for prefix in ["gauge", "grid", "sg", "ch", "g", "dms"] {
        if let Some(d) = n.strip_prefix(prefix) {
            if let Ok(k) = d.parse::<u8>() {
                if (1..=8).contains(&k) {
                    return Some(k - 1);
                }
            }
        }
    }
    None
}

/// Guesses one column's kind from its header name.
#[must_use]
pub fn guess_kind(name: &str) -> ColumnKind {
    let n = normalize(name);
    let n = n.as_str();
    const STRESS: [&[&str]; 6] = [
        &["sx", "σx", "sxx", "s11", "sigmax", "sigmaxx", "σxx"],
        &["sy", "σy", "syy", "s22", "sigmay", "sigmayy", "σyy"],
        &["sz", "σz", "szz", "s33", "sigmaz", "sigmazz", "σzz"],
        &["txy", "τxy", "sxy", "s12", "tauxy", "syx", "s21"],
        &["tyz", "τyz", "syz", "s23", "tauyz", "szy", "s32"],
        &[
            "tzx", "τzx", "szx", "s31", "tauzx", "sxz", "s13", "txz", "τxz", "tauxz",
        ],
    ];
    const STRAIN: [&[&str]; 6] = [
        &["ex", "εx", "exx", "e11", "epsx", "epsilonx", "εxx"],
        &["ey", "εy", "eyy", "e22", "epsy", "epsilony", "εyy"],
        &["ez", "εz", "ezz", "e33", "epsz", "epsilonz", "εzz"],
        &["gxy", "γxy", "gammaxy"],
        &["gyz", "γyz", "gammayz"],
        &["gzx", "γzx", "gammazx", "gxz", "γxz", "gammaxz"],
    ];
    if [
        "id", "node", "nodeid", "element", "elem", "label", "point", "name", "no", "nr",
    ]
    .contains(&n)
    {
        return ColumnKind::Label;
    }
    if ["t", "time", "times", "zeit", "timestamp", "temps", "tiempo"].contains(&n) {
        return ColumnKind::Time;
    }
    for (k, names) in (0u8..).zip(STRESS) {
        if names.contains(&n) {
            return ColumnKind::Stress(k);
        }
    }
    for (k, names) in (0u8..).zip(STRAIN) {
        if names.contains(&n) {
            return ColumnKind::Strain(k);
        }
    }
    gauge_number(n).map_or(ColumnKind::Skip, ColumnKind::Gauge)
}

/// Every column's guessed kind: from the header when there is one; without a header, six
/// columns are taken as σx σy σz τxy τyz τzx and three as σx σy τxy (the plane case), and
/// anything else is left for the user to say.
#[must_use]
pub fn guess_kinds(shape: &Shape) -> Vec<ColumnKind> {
    match &shape.header {
        Some(h) => h.iter().map(|n| guess_kind(n)).collect(),
        None => match shape.columns {
            6 => (0..6).map(ColumnKind::Stress).collect(),
            3 => vec![
                ColumnKind::Stress(0),
                ColumnKind::Stress(1),
                ColumnKind::Stress(3),
            ],
            n => vec![ColumnKind::Skip; n],
        },
    }
}
