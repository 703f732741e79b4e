//! A load history from a table's rows, for the life in cycles: a column's values, one stress
//! component of each row's state, the signed von Mises of each row, or each row's in-plane
//! components (σx, σy, τxy) for the critical-plane count. The rows are the computed ones, in
//! file order; the history stays in this browser tab (it is not in the case link).

use super::{row_tensor, ColumnKind, TableOutcome};
use crate::model::case::Case;
use stresscase_core::equivalent::signed_von_mises;
use stresscase_core::StressUnit;

/// Where a table's history comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HistoryFrom {
    /// A column's values, read as stresses in the table's stress unit (0-based column).
    Column(usize),
    /// A stress component of each row's state (tensor order σx, σy, σz, τxy, τyz, τzx).
    Component(u8),
    /// von Mises signed by the principal stress of largest magnitude.
    SignedVonMises,
    /// The normal stress on planes every 2° in the x–y plane, the most damaged plane governing.
    CriticalPlane,
}

/// Component names in tensor order.
pub const COMPONENTS: [&str; 6] = ["σx", "σy", "σz", "τxy", "τyz", "τzx"];

impl HistoryFrom {
    /// In words, with the column's name.
    #[must_use]
    pub fn describe(&self, names: &[String]) -> String {
        match *self {
            Self::Column(j) => format!(
                "column “{}” read as stress",
                names.get(j).map_or("?", String::as_str)
            ),
            Self::Component(k) => format!("{} of each row's state", COMPONENTS[usize::from(k) % 6]),
            Self::SignedVonMises => {
                "von Mises of each row, signed by its principal stress of largest magnitude".into()
            }
            Self::CriticalPlane => {
                "normal stress on planes every 2° in the x–y plane (critical plane)".into()
            }
        }
    }
}

/// The values of a table's history, in the case's unit.
#[derive(Debug, Clone, PartialEq)]
pub enum HistoryValues {
    /// One value per row.
    Signal(Vec<f64>),
    /// (σx, σy, τxy) per row.
    Planes(Vec<[f64; 3]>),
}

/// A table's history as the life panel takes it.
#[derive(Debug, Clone, PartialEq)]
pub struct TableHistory {
    /// Where it came from, in words (file and source).
    pub about: String,
    /// The values.
    pub values: HistoryValues,
    /// How long one pass of the table lasts, seconds, when it has a time column.
    pub seconds: Option<f64>,
}

impl TableHistory {
    /// Rows in the history.
    #[must_use]
    pub fn len(&self) -> usize {
        match &self.values {
            HistoryValues::Signal(v) => v.len(),
            HistoryValues::Planes(v) => v.len(),
        }
    }

    /// Whether it has no rows.
    #[must_use]
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }
}

/// The history of a computed table. `values` are the table's numbers row by row (`columns`
/// each), `unit` the stress columns' unit.
///
/// # Errors
/// Why the history cannot be made (no rows, a row the path refuses).
pub fn table_history(
    (values, columns): (&[f64], usize),
    kinds: &[ColumnKind],
    unit: StressUnit,
    case: &Case,
    outcome: &TableOutcome,
    from: HistoryFrom,
) -> Result<HistoryValues, String> {
    if outcome.rows.len() < 2 {
        return Err("the table needs at least two computed rows to be a history".into());
    }
    let row = |i: usize| &values[i * columns..(i + 1) * columns];
    let tensor = |i: usize| row_tensor(row(i), kinds, unit, case);
    Ok(match from {
        HistoryFrom::Column(j) if j < columns => {
            let k = unit.convert(1.0, case.unit);
            HistoryValues::Signal(outcome.rows.iter().map(|&i| row(i)[j] * k).collect())
        }
        HistoryFrom::Column(_) => return Err("no such column".into()),
        HistoryFrom::Component(k) => HistoryValues::Signal(
            outcome
                .rows
                .iter()
                .map(|&i| tensor(i).map(|t| t.components()[usize::from(k) % 6]))
                .collect::<Result<_, _>>()?,
        ),
        HistoryFrom::SignedVonMises => HistoryValues::Signal(
            outcome
                .measures
                .iter()
                .map(|m| signed_von_mises(m.principal[0], m.principal[2], m.von_mises))
                .collect(),
        ),
        HistoryFrom::CriticalPlane => HistoryValues::Planes(
            outcome
                .rows
                .iter()
                .map(|&i| {
                    tensor(i).map(|t| {
                        let c = t.components();
                        [c[0], c[1], c[3]]
                    })
                })
                .collect::<Result<_, _>>()?,
        ),
    })
}

/// The time a table's computed rows span, seconds, from its time column (last − first plus
/// one step, so a repeated history joins up).
#[must_use]
pub fn duration(
    values: &[f64],
    columns: usize,
    kinds: &[ColumnKind],
    outcome: &TableOutcome,
) -> Option<f64> {
    let t = kinds.iter().position(|k| *k == ColumnKind::Time)?;
    let at = |i: usize| values.get(i * columns + t).copied();
    let (&first, &last) = (outcome.rows.first()?, outcome.rows.last()?);
    let (a, b) = (at(first)?, at(last)?);
    let n = outcome.rows.len();
    let span = b - a;
    (n > 1 && span.is_finite() && span > 0.0).then(|| span * n as f64 / (n - 1) as f64)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::CaseForm;
    use crate::model::table::evaluate;
    use ColumnKind::{Stress, Time};

    #[test]
    fn each_source_gives_one_value_per_row() {
        let c = Case::from_form(&CaseForm::demo()).unwrap();
        let e = c.evaluate().unwrap();
        // time, σx, σy, τxy in kPa: uniaxial tension, then compression, then shear.
        let values = [
            0.0, 100e3, 0.0, 0.0, //
            0.5, -150e3, 0.0, 0.0, //
            1.0, 0.0, 0.0, 80e3,
        ];
        let kinds = [Time, Stress(0), Stress(1), Stress(3)];
        let out = evaluate(&values, 4, &kinds, StressUnit::KPa, &c, &e.judgement).unwrap();
        let get = |from| table_history((&values, 4), &kinds, StressUnit::KPa, &c, &out, from);
        assert_eq!(
            get(HistoryFrom::Column(1)),
            Ok(HistoryValues::Signal(vec![100.0, -150.0, 0.0]))
        );
        assert_eq!(
            get(HistoryFrom::Component(3)),
            Ok(HistoryValues::Signal(vec![0.0, 0.0, 80.0]))
        );
        let Ok(HistoryValues::Signal(svm)) = get(HistoryFrom::SignedVonMises) else {
            panic!()
        };
        // Tension +σvm, compression −σvm, shear √3·τ (σ1 = −σ3: a tie counts as tension).
        assert!((svm[0] - 100.0).abs() < 1e-9 && (svm[1] + 150.0).abs() < 1e-9);
        assert!((svm[2] - 80.0 * 3f64.sqrt()).abs() < 1e-9);
        assert_eq!(
            get(HistoryFrom::CriticalPlane),
            Ok(HistoryValues::Planes(vec![
                [100.0, 0.0, 0.0],
                [-150.0, 0.0, 0.0],
                [0.0, 0.0, 80.0]
            ]))
        );
        // Three rows 0.5 s apart span 1.5 s once the history repeats.
        assert_eq!(duration(&values, 4, &kinds, &out), Some(1.5));
    }
}
