//! The table path: every row of a table of many points as a stress state of the case, and its
//! measures. A row's numbers go through the same path a single point would: stress columns
//! are the tensor (converted from the columns' unit to the case's); gauge columns go through
//! the rosette path with the case's layout, angles, correction and elastic constants; strain
//! columns through Hooke's law with the case's condition. Then core measures every tensor
//! ([`stresscase_core::points`]) with the case's material and criterion in use.
//!
//! A row whose numbers the path refuses (a rosette reduction that overflows, say) is refused
//! with the reason; the whole table is refused when its columns do not make one kind of state.

pub mod history;
pub mod picture;

use crate::model::case::Case;
use crate::model::choices::{Choices, Condition, Layout, Source};
use crate::model::inputs::Num;
use crate::model::judge::Judgement;
use crate::model::source::{self, Numbers};
use stresscase_core::points::{measure_all_into, PointMeasures};
use stresscase_core::{StressTensor, StressUnit};

/// What a column holds, as the user confirms it (the file format guesses it from the header).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ColumnKind {
    /// Not used.
    Skip,
    /// A row's id or label (node number, point name), read as text.
    Label,
    /// Time (for plots against time).
    Time,
    /// A stress component, tensor order: σx, σy, σz, τxy, τyz, τzx.
    Stress(u8),
    /// A rosette gauge's reading (0-based gauge), in the case's strain unit.
    Gauge(u8),
    /// A strain component, in the case's strain unit: εx, εy, εz, γxy, γyz, γzx (engineering
    /// shear strains).
    Strain(u8),
}

/// The kind of state a table's rows give.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RowState {
    /// Stress components, in the given unit.
    Stress(StressUnit),
    /// Rosette readings.
    Rosette,
    /// Strains.
    Strain,
}

/// Why a whole table cannot be computed.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TableProblem(pub String);

/// The computed rows of a table.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct TableOutcome {
    /// Index (into the rows given) of each computed row.
    pub rows: Vec<usize>,
    /// Its measures, in the case's unit.
    pub measures: Vec<PointMeasures>,
    /// Rows the path refused: index and reason.
    pub refused: Vec<(usize, String)>,
}

impl TableOutcome {
    /// Empty, with room for `rows` computed rows, so computing in chunks never regrows (and
    /// never holds a table's results twice while copying them).
    #[must_use]
    pub fn with_room(rows: usize) -> Self {
        Self {
            rows: Vec::with_capacity(rows),
            measures: Vec::with_capacity(rows),
            refused: Vec::new(),
        }
    }
}

/// Which state the columns give, and the column of each component/gauge.
///
/// # Errors
/// A table with no usable columns, or with more than one kind of state.
pub fn row_state(kinds: &[ColumnKind], unit: StressUnit) -> Result<RowState, TableProblem> {
    let has = |f: fn(&ColumnKind) -> bool| kinds.iter().any(f);
    let stress = has(|k| matches!(k, ColumnKind::Stress(_)));
    let gauge = has(|k| matches!(k, ColumnKind::Gauge(_)));
    let strain = has(|k| matches!(k, ColumnKind::Strain(_)));
    match (stress, gauge, strain) {
        (true, false, false) => Ok(RowState::Stress(unit)),
        (false, true, false) => Ok(RowState::Rosette),
        (false, false, true) => Ok(RowState::Strain),
        (false, false, false) => Err(TableProblem(
            "no column is marked as stress components, gauge readings or strains".into(),
        )),
        _ => Err(TableProblem(
            "the columns mix stresses, gauge readings and strains: mark one kind".into(),
        )),
    }
}

/// The column holding `kind`, if any.
fn column_of(kinds: &[ColumnKind], kind: ColumnKind) -> Option<usize> {
    kinds.iter().position(|&k| k == kind)
}

/// A row's numbers, falling back to the case's for everything the row does not hold.
struct RowNumbers<'a> {
    case: &'a Case,
    own: Vec<(Num, f64)>,
}

impl Numbers for RowNumbers<'_> {
    fn get(&self, n: Num) -> f64 {
        self.own
            .iter()
            .find(|(k, _)| *k == n)
            .map_or_else(|| self.case.get(n), |(_, v)| *v)
    }
    fn absent(&self, n: Num) -> bool {
        !self.own.iter().any(|(k, _)| *k == n) && self.case.absent(n)
    }
}

/// The rows (`columns` numbers each, row-major) as states of `case`, measured with the
/// material and criterion of its `judgement`.
///
/// # Errors
/// A table whose columns do not make one kind of state, or do not fit the case's rosette or
/// Hooke's-law condition.
pub fn evaluate(
    values: &[f64],
    columns: usize,
    kinds: &[ColumnKind],
    unit: StressUnit,
    case: &Case,
    judgement: &Judgement,
) -> Result<TableOutcome, TableProblem> {
    let mut out = TableOutcome::default();
    let rows = values.len().checked_div(columns).unwrap_or(0);
    evaluate_rows(
        values,
        columns,
        kinds,
        unit,
        (case, judgement),
        0..rows,
        &mut out,
    )?;
    Ok(out)
}

/// [`evaluate`] for the rows in `range` only, appended to `out` (the page computes a large
/// table a chunk at a time, handing control back to the browser between chunks).
///
/// # Errors
/// As [`evaluate`]; `out` is then left as it was.
pub fn evaluate_rows(
    values: &[f64],
    columns: usize,
    kinds: &[ColumnKind],
    unit: StressUnit,
    (case, judgement): (&Case, &Judgement),
    range: core::ops::Range<usize>,
    out: &mut TableOutcome,
) -> Result<(), TableProblem> {
    let path = RowPath::new(kinds, unit, case)?;
    let row = |i: usize| &values[i * columns..(i + 1) * columns];
    let first_new = out.rows.len();
    let refused_before = out.refused.len();
    // The chunk's tensors live only until they are measured: a table's results keep the
    // measures, and a row opened as the case is sent through its path again.
    let mut tensors = Vec::with_capacity(range.len());
    for i in range {
        match path.tensor(row(i), case) {
            Ok(t) => {
                out.rows.push(i);
                tensors.push(t);
            }
            Err(why) => out.refused.push((i, why)),
        }
    }
    match measure_all_into(
        &tensors,
        judgement.in_use,
        &judgement.strengths,
        &mut out.measures,
    ) {
        Ok(()) => Ok(()),
        Err(e) => {
            out.rows.truncate(first_new);
            out.refused.truncate(refused_before);
            Err(TableProblem(e.to_string()))
        }
    }
}

/// The stress state of one row (`row`: its numbers) through the case's path, as
/// [`evaluate_rows`] finds it; `Err` holds why the row is refused.
///
/// # Errors
/// As [`evaluate`] for the columns; the row's own refusal as text.
pub fn row_tensor(
    row: &[f64],
    kinds: &[ColumnKind],
    unit: StressUnit,
    case: &Case,
) -> Result<StressTensor, String> {
    RowPath::new(kinds, unit, case)
        .map_err(|p| p.0)?
        .tensor(row, case)
}

/// How a row becomes a stress state: its components scaled to the case's unit, or its gauge
/// readings or strains through the case's rosette or Hooke's-law path.
enum RowPath {
    Stress {
        col: [Option<usize>; 6],
        scale: f64,
    },
    Source {
        choices: Choices,
        nums: Vec<(Num, usize)>,
    },
}

impl RowPath {
    fn new(kinds: &[ColumnKind], unit: StressUnit, case: &Case) -> Result<Self, TableProblem> {
        Ok(match row_state(kinds, unit)? {
            RowState::Stress(from) => RowPath::Stress {
                col: core::array::from_fn(|k| column_of(kinds, ColumnKind::Stress(k as u8))),
                scale: from.convert(1.0, case.unit),
            },
            state => {
                let (choices, nums) = path_numbers(state, kinds, &case.choices)?;
                RowPath::Source { choices, nums }
            }
        })
    }

    fn tensor(&self, r: &[f64], case: &Case) -> Result<StressTensor, String> {
        match self {
            RowPath::Stress { col, scale } => {
                let c: [f64; 6] = core::array::from_fn(|j| col[j].map_or(0.0, |c| r[c] * scale));
                StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).map_err(|e| e.to_string())
            }
            RowPath::Source { choices, nums } => {
                let own = nums.iter().map(|&(n, c)| (n, r[c])).collect();
                let n = RowNumbers { case, own };
                match source::evaluate(choices, &n, case.unit, case.angle_unit) {
                    Ok(Some((t, _))) => Ok(t),
                    Ok(None) => Err("no stress state".into()),
                    Err(p) => Err(p.message),
                }
            }
        }
    }
}

/// The choices a rosette or strain row is evaluated with, and which column feeds which number.
fn path_numbers(
    state: RowState,
    kinds: &[ColumnKind],
    case: &Choices,
) -> Result<(Choices, Vec<(Num, usize)>), TableProblem> {
    if state == RowState::Rosette {
        let c = Choices {
            source: Source::Rosette,
            ..*case
        };
        let gauges = kinds
            .iter()
            .filter(|k| matches!(k, ColumnKind::Gauge(_)))
            .count();
        let want = usize::from(c.gauge_count());
        if gauges != want {
            let layout = match c.layout {
                Layout::Rectangular => "rectangular (0°, 45°, 90°)",
                Layout::Delta => "delta (0°, 60°, 120°)",
                Layout::Custom => "custom",
            };
            return Err(TableProblem(format!(
                "the case's {layout} rosette has {want} gauges and the table {gauges} gauge columns: set the rosette under “Where the stress comes from”, or mark the columns"
            )));
        }
        let mut nums = Vec::new();
        for g in 0..c.gauge_count() {
            let col = column_of(kinds, ColumnKind::Gauge(g))
                .ok_or_else(|| TableProblem(format!("no column is marked as gauge {}", g + 1)))?;
            nums.push((Num::gauge_reading(g), col));
        }
        return Ok((c, nums));
    }
    let c = Choices {
        source: Source::Strain,
        ..*case
    };
    const NUMS: [Num; 6] = [Num::Ex, Num::Ey, Num::Ez, Num::Gxy, Num::Gyz, Num::Gzx];
    const NAMES: [&str; 6] = ["εx", "εy", "εz", "γxy", "γyz", "γzx"];
    let needed: &[usize] = match c.condition {
        Condition::Full => &[0, 1, 2, 3, 4, 5],
        Condition::PlaneStress | Condition::PlaneStrain => &[0, 1, 3],
    };
    let mut nums = Vec::new();
    for &k in needed {
        let col = column_of(kinds, ColumnKind::Strain(k as u8)).ok_or_else(|| {
            TableProblem(format!(
                "no column is marked as {}, which the case's Hooke's-law condition needs",
                NAMES[k]
            ))
        })?;
        nums.push((NUMS[k], col));
    }
    Ok((c, nums))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::case::CaseForm;
    use crate::model::evaluation::Evaluation;
    use ColumnKind::{Gauge, Label, Skip, Strain, Stress};

    fn case_of(f: &CaseForm) -> (Case, Evaluation) {
        let c = Case::from_form(f).unwrap();
        let e = c.evaluate().unwrap();
        (c, e)
    }

    #[test]
    fn a_stress_row_is_the_same_state_typed_in() {
        let f = CaseForm::demo(); // σx = 84, σy = −22, τxy = 37 MPa
        let (c, e) = case_of(&f);
        // id, σx, σy, τxy in kPa, and a column to skip.
        let values = [7.0, 84e3, -22e3, 37e3, 99.0, 8.0, 0.0, 0.0, 0.0, 1.0];
        let kinds = [Label, Stress(0), Stress(1), Stress(3), Skip];
        let out = evaluate(&values, 5, &kinds, StressUnit::KPa, &c, &e.judgement).unwrap();
        assert_eq!(out.rows, vec![0, 1]);
        let m = &out.measures[0];
        assert!((m.von_mises - e.equivalent.von_mises).abs() < 1e-12 * e.equivalent.von_mises);
        assert!((m.principal[0] - e.principal.sigma1()).abs() < 1e-12 * 84.0);
        let n = e.judgement.in_use_verdict().unwrap().factor.unwrap();
        assert!((m.factor - n).abs() < 1e-12 * n);
        assert_eq!(out.measures[1].factor, f64::INFINITY);
    }

    #[test]
    fn a_gauge_row_goes_through_the_cases_rosette() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Rosette; // rectangular, demo readings 640, 215, −180 µε
        let (c, e) = case_of(&f);
        let values = [0.5, 640.0, 215.0, -180.0, 1.0, 0.0, 0.0, 0.0];
        let kinds = [ColumnKind::Time, Gauge(0), Gauge(1), Gauge(2)];
        let out = evaluate(&values, 4, &kinds, StressUnit::MPa, &c, &e.judgement).unwrap();
        let t = row_tensor(&values[..4], &kinds, StressUnit::MPa, &c).unwrap();
        assert_eq!(t, e.tensor);
        assert_eq!(out.measures[1].factor, f64::INFINITY);
        // A fourth gauge column does not fit a three-gauge rosette.
        let kinds = [Gauge(3), Gauge(0), Gauge(1), Gauge(2)];
        let p = evaluate(&values, 4, &kinds, StressUnit::MPa, &c, &e.judgement).unwrap_err();
        assert!(p.0.contains("3 gauges and the table 4"), "{}", p.0);
    }

    #[test]
    fn a_strain_row_goes_through_hookes_law() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Strain; // plane stress, demo εx 520, εy −160, γxy 300 µε
        let (c, e) = case_of(&f);
        let values = [300.0, 520.0, -160.0];
        let kinds = [Strain(3), Strain(0), Strain(1)];
        let out = evaluate(&values, 3, &kinds, StressUnit::MPa, &c, &e.judgement).unwrap();
        assert_eq!(out.rows, vec![0]);
        let t = row_tensor(&values, &kinds, StressUnit::MPa, &c).unwrap();
        assert_eq!(t, e.tensor);
        let p = evaluate(
            &values,
            3,
            &[Strain(3), Strain(0), Skip],
            StressUnit::MPa,
            &c,
            &e.judgement,
        )
        .unwrap_err();
        assert!(p.0.contains("εy"), "{}", p.0);
    }

    #[test]
    fn rows_computed_in_chunks_are_the_rows_computed_at_once() {
        let mut f = CaseForm::demo();
        f.choices.source = Source::Rosette;
        let (c, e) = case_of(&f);
        // Time and three gauges; every fifth row overflows the rosette reduction.
        let values: Vec<f64> = (0..40)
            .flat_map(|i| {
                let g = if i % 5 == 4 {
                    1e306
                } else {
                    f64::from(i) * 10.0
                };
                [f64::from(i), 640.0 - g, 215.0, g]
            })
            .collect();
        let kinds = [ColumnKind::Time, Gauge(0), Gauge(1), Gauge(2)];
        let whole = evaluate(&values, 4, &kinds, StressUnit::MPa, &c, &e.judgement).unwrap();
        assert_eq!((whole.rows.len(), whole.refused.len()), (32, 8));
        let mut out = TableOutcome::default();
        for start in (0..40).step_by(7) {
            let range = start..(start + 7).min(40);
            evaluate_rows(
                &values,
                4,
                &kinds,
                StressUnit::MPa,
                (&c, &e.judgement),
                range,
                &mut out,
            )
            .unwrap();
        }
        assert_eq!(out, whole);
    }

    #[test]
    fn columns_that_make_no_single_state_are_refused() {
        let (c, e) = case_of(&CaseForm::demo());
        for kinds in [[Label, Skip], [Stress(0), Gauge(0)]] {
            assert!(evaluate(&[1.0, 2.0], 2, &kinds, StressUnit::MPa, &c, &e.judgement).is_err());
        }
    }
}
