//! The computed rows of a table written back out as CSV.

use super::Table;

/// The computed rows as CSV: a comment line saying where they come from, a header, then one
/// record per row in `order` (indices into `out`): the file line, the label (when there is
/// one), the row's own numbers, then σ1, σ2, σ3, τmax, von Mises, Tresca (in `unit`),
/// triaxiality and the factor of safety. Numbers are written in full (shortest round-trip
/// form); an undefined one is left empty.
#[must_use]
pub fn write_results(
    t: &Table,
    names: &[String],
    out: &crate::model::table::TableOutcome,
    order: &[usize],
    unit: &str,
    from: &str,
) -> String {
    let mut w = csv::WriterBuilder::new().from_writer(Vec::new());
    let num = |v: f64| {
        if v.is_finite() {
            crate::model::numfmt::write_number(v)
        } else if v == f64::INFINITY {
            "inf".to_string()
        } else {
            String::new()
        }
    };
    let mut header = vec!["line".to_string()];
    let labelled = !t.label_ends.is_empty();
    if labelled {
        header.push("label".into());
    }
    header.extend(names.iter().cloned());
    for h in [
        "sigma1",
        "sigma2",
        "sigma3",
        "tau_max",
        "von_mises",
        "tresca",
    ] {
        header.push(format!("{h} [{unit}]"));
    }
    header.push("triaxiality".into());
    header.push("factor_of_safety".into());
    let _ = w.write_record(&header);
    for &k in order {
        let Some(&i) = out.rows.get(k) else { continue };
        let m = &out.measures[k];
        let mut rec = vec![t.lines[i].to_string()];
        if labelled {
            rec.push(t.label(i).unwrap_or_default().to_string());
        }
        rec.extend(t.row(i).iter().map(|&v| num(v)));
        rec.extend(m.stresses().map(num));
        rec.push(num(m.triaxiality));
        rec.push(num(m.factor));
        let _ = w.write_record(&rec);
    }
    let body = String::from_utf8(w.into_inner().unwrap_or_default()).unwrap_or_default();
    format!("# Stresscase: rows of {from}, computed with the case on screen\n{body}")
}
