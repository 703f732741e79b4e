//! Material strengths for judging a stress state, and a small built-in table of common
//! engineering materials with the source and basis (typical or minimum) of every row.
//!
//! Strengths are magnitudes (positive numbers) in any stress unit; the table is in MPa and GPa.
//! Ductility follows the elongation at fracture: at least 5 % is treated as ductile (common
//! practice, e.g. Shigley's *Mechanical Engineering Design*, §5-1).

use core::fmt;

/// Elongation at fracture (percent) from which a material is treated as ductile (common practice).
pub const DUCTILE_ELONGATION: f64 = 5.0;

/// The strengths a failure or fatigue check needs, validated.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Strengths {
    sy: Option<f64>,
    sut: f64,
    suc: Option<f64>,
    elongation: f64,
    se: Option<f64>,
}

/// Why material data were refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum MaterialError {
    /// A strength is not a positive finite number; names it.
    NotPositive(&'static str),
    /// The yield strength exceeds the ultimate tensile strength.
    YieldAboveUltimate,
    /// A brittle material's compressive strength is below its tensile strength.
    CompressionBelowTension,
    /// Elongation is negative, above 1000 % or not finite.
    Elongation,
    /// A ductile material (elongation ≥ 5 %) needs a yield strength.
    DuctileNeedsYield,
}

impl fmt::Display for MaterialError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::NotPositive(n) => write!(f, "{n} must be a positive number"),
            Self::YieldAboveUltimate => write!(
                f,
                "the yield strength cannot exceed the ultimate tensile strength"
            ),
            Self::CompressionBelowTension => write!(
                f,
                "a brittle material's ultimate compressive strength is at least its tensile strength (cast irons: about 3 to 4 times)"
            ),
            Self::Elongation => write!(f, "elongation must be between 0 and 1000 %"),
            Self::DuctileNeedsYield => write!(
                f,
                "a ductile material (elongation of 5 % or more) needs a yield strength"
            ),
        }
    }
}

fn positive(v: f64, name: &'static str) -> Result<f64, MaterialError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(MaterialError::NotPositive(name))
    }
}

impl Strengths {
    /// Validated strengths: yield Sy (optional for brittle materials), ultimate tensile Sut,
    /// ultimate compressive Suc (magnitude; optional), elongation at fracture in percent, and the
    /// fully corrected endurance limit Se if known.
    ///
    /// # Errors
    /// [`MaterialError`] naming the value that is wrong.
    pub fn try_new(
        sy: Option<f64>,
        sut: f64,
        suc: Option<f64>,
        elongation: f64,
        se: Option<f64>,
    ) -> Result<Self, MaterialError> {
        let sut = positive(sut, "the ultimate tensile strength")?;
        let sy = sy.map(|v| positive(v, "the yield strength")).transpose()?;
        let suc = suc
            .map(|v| positive(v, "the ultimate compressive strength"))
            .transpose()?;
        let se = se.map(|v| positive(v, "the endurance limit")).transpose()?;
        if !(elongation.is_finite() && (0.0..=1000.0).contains(&elongation)) {
            return Err(MaterialError::Elongation);
        }
        if sy.is_some_and(|y| y > sut) {
            return Err(MaterialError::YieldAboveUltimate);
        }
        let ductile = elongation >= DUCTILE_ELONGATION;
        if !ductile && suc.is_some_and(|c| c < sut) {
            return Err(MaterialError::CompressionBelowTension);
        }
        if ductile && sy.is_none() {
            return Err(MaterialError::DuctileNeedsYield);
        }
        Ok(Self {
            sy,
            sut,
            suc,
            elongation,
            se,
        })
    }

    /// Tensile yield strength Sy, if given.
    #[must_use]
    pub fn yield_strength(&self) -> Option<f64> {
        self.sy
    }

    /// Ultimate tensile strength Sut.
    #[must_use]
    pub fn ultimate_tensile(&self) -> f64 {
        self.sut
    }

    /// Ultimate compressive strength Suc (magnitude), if given.
    #[must_use]
    pub fn ultimate_compressive(&self) -> Option<f64> {
        self.suc
    }

    /// Elongation at fracture, percent.
    #[must_use]
    pub fn elongation(&self) -> f64 {
        self.elongation
    }

    /// The endurance limit Se, if given.
    #[must_use]
    pub fn endurance(&self) -> Option<f64> {
        self.se
    }

    /// True when elongation ≥ 5 % (common practice).
    #[must_use]
    pub fn is_ductile(&self) -> bool {
        self.elongation >= DUCTILE_ELONGATION
    }

    /// The same strengths multiplied by `k` (a unit change).
    #[must_use]
    pub fn scaled(&self, k: f64) -> Self {
        Self {
            sy: self.sy.map(|v| v * k),
            sut: self.sut * k,
            suc: self.suc.map(|v| v * k),
            elongation: self.elongation,
            se: self.se.map(|v| v * k),
        }
    }
}

/// Whether a table row gives typical values or specified minimums.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Basis {
    /// Typical (mean) values: not design allowables.
    Typical,
    /// Specified minimum values of a standard.
    Minimum,
}

/// One row of the built-in table. Strengths in MPa, E in GPa.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TableMaterial {
    /// Stable short key for links.
    pub key: &'static str,
    /// Name and condition.
    pub name: &'static str,
    /// Typical or minimum.
    pub basis: Basis,
    /// Where the numbers come from (read from memory; see each).
    pub source: &'static str,
    /// Tensile yield strength, MPa (none for grey cast iron).
    pub sy: Option<f64>,
    /// Ultimate tensile strength, MPa.
    pub sut: f64,
    /// Ultimate compressive strength, MPa (brittle materials).
    pub suc: Option<f64>,
    /// Elongation at fracture, percent.
    pub elongation: f64,
    /// Young's modulus, GPa.
    pub e: f64,
    /// Poisson's ratio.
    pub nu: f64,
    /// Coefficient of thermal expansion near room temperature, µε/K (typical; from memory, see
    /// [`ALPHA_SOURCE`]).
    pub alpha: f64,
}

/// Where the expansion coefficients of the table come from.
pub const ALPHA_SOURCE: &str =
    "α: typical room-temperature values, Shigley's table A-5 and ASM handbook data, from memory";

impl TableMaterial {
    /// The row's strengths (MPa), endurance left to the fatigue estimate.
    ///
    /// # Errors
    /// Never for the built-in rows (a unit test checks them all).
    pub fn strengths(&self) -> Result<Strengths, MaterialError> {
        Strengths::try_new(self.sy, self.sut, self.suc, self.elongation, None)
    }
}

const SHIGLEY_A20: &str =
    "Shigley's Mechanical Engineering Design, table A-20 (ASTM minimum strengths), from memory";
const SHIGLEY_A21: &str =
    "Shigley's Mechanical Engineering Design, table A-21 (typical, after quench and temper), from memory";
const SHIGLEY_A5: &str = "E and ν: Shigley's table A-5, from memory";

/// The built-in materials. Values were recalled from the named handbooks, not read: check them
/// against the material's certificate or the applicable standard before relying on them.
pub const TABLE: [TableMaterial; 14] = [
    TableMaterial {
        key: "1020hr",
        name: "Carbon steel AISI 1020, hot-rolled",
        basis: Basis::Minimum,
        source: SHIGLEY_A20,
        sy: Some(210.0),
        sut: 380.0,
        suc: None,
        elongation: 25.0,
        e: 207.0,
        nu: 0.292,
        alpha: 11.7,
    },
    TableMaterial {
        key: "1020cd",
        name: "Carbon steel AISI 1020, cold-drawn",
        basis: Basis::Minimum,
        source: SHIGLEY_A20,
        sy: Some(390.0),
        sut: 470.0,
        suc: None,
        elongation: 15.0,
        e: 207.0,
        nu: 0.292,
        alpha: 11.7,
    },
    TableMaterial {
        key: "1045hr",
        name: "Carbon steel AISI 1045, hot-rolled",
        basis: Basis::Minimum,
        source: SHIGLEY_A20,
        sy: Some(310.0),
        sut: 570.0,
        suc: None,
        elongation: 16.0,
        e: 207.0,
        nu: 0.292,
        alpha: 11.7,
    },
    TableMaterial {
        key: "1045cd",
        name: "Carbon steel AISI 1045, cold-drawn",
        basis: Basis::Minimum,
        source: SHIGLEY_A20,
        sy: Some(530.0),
        sut: 630.0,
        suc: None,
        elongation: 12.0,
        e: 207.0,
        nu: 0.292,
        alpha: 11.7,
    },
    TableMaterial {
        key: "4140qt425",
        name: "Alloy steel AISI 4140, quenched and tempered at 425 °C",
        basis: Basis::Typical,
        source: SHIGLEY_A21,
        sy: Some(1140.0),
        sut: 1250.0,
        suc: None,
        elongation: 12.0,
        e: 207.0,
        nu: 0.292,
        alpha: 12.3,
    },
    TableMaterial {
        key: "304ann",
        name: "Stainless steel 304, annealed",
        basis: Basis::Minimum,
        source: "ASTM A240 minimum properties, from memory",
        sy: Some(205.0),
        sut: 515.0,
        suc: None,
        elongation: 40.0,
        e: 193.0,
        nu: 0.29,
        alpha: 17.3,
    },
    TableMaterial {
        key: "316ann",
        name: "Stainless steel 316, annealed",
        basis: Basis::Minimum,
        source: "ASTM A240 minimum properties, from memory",
        sy: Some(205.0),
        sut: 515.0,
        suc: None,
        elongation: 40.0,
        e: 193.0,
        nu: 0.29,
        alpha: 16.0,
    },
    TableMaterial {
        key: "6061t6",
        name: "Aluminium alloy 6061-T6",
        basis: Basis::Typical,
        source: "ASM Handbook vol. 2 typical properties, from memory",
        sy: Some(276.0),
        sut: 310.0,
        suc: None,
        elongation: 12.0,
        e: 68.9,
        nu: 0.33,
        alpha: 23.6,
    },
    TableMaterial {
        key: "7075t6",
        name: "Aluminium alloy 7075-T6",
        basis: Basis::Typical,
        source: "ASM Handbook vol. 2 typical properties, from memory",
        sy: Some(503.0),
        sut: 572.0,
        suc: None,
        elongation: 11.0,
        e: 71.7,
        nu: 0.33,
        alpha: 23.4,
    },
    TableMaterial {
        key: "ti64",
        name: "Titanium alloy Ti-6Al-4V, annealed",
        basis: Basis::Minimum,
        source: "ASTM B348 grade 5 minimum properties, from memory",
        sy: Some(828.0),
        sut: 895.0,
        suc: None,
        elongation: 10.0,
        e: 114.0,
        nu: 0.34,
        alpha: 8.6,
    },
    TableMaterial {
        key: "gci30",
        name: "Grey cast iron, ASTM A48 class 30",
        basis: Basis::Minimum,
        source: "Shigley's table A-24 (Sut minimum, Suc typical), from memory",
        sy: None,
        sut: 214.0,
        suc: Some(752.0),
        elongation: 0.5,
        e: 100.0,
        nu: 0.211,
        alpha: 10.8,
    },
    TableMaterial {
        key: "gci40",
        name: "Grey cast iron, ASTM A48 class 40",
        basis: Basis::Minimum,
        source: "Shigley's table A-24 (Sut minimum, Suc typical), from memory",
        sy: None,
        sut: 293.0,
        suc: Some(965.0),
        elongation: 0.5,
        e: 110.0,
        nu: 0.211,
        alpha: 10.8,
    },
    TableMaterial {
        key: "c36000",
        name: "Free-cutting brass C36000, half hard",
        basis: Basis::Typical,
        source: "Copper Development Association data sheet, typical, from memory",
        sy: Some(310.0),
        sut: 385.0,
        suc: None,
        elongation: 25.0,
        e: 97.0,
        nu: 0.31,
        alpha: 20.5,
    },
    TableMaterial {
        key: "pa66",
        name: "Polyamide PA 66, dry as moulded",
        basis: Basis::Typical,
        source: "manufacturers' typical data sheets, from memory; strongly temperature and moisture dependent",
        sy: Some(80.0),
        sut: 82.0,
        suc: None,
        elongation: 40.0,
        e: 3.0,
        nu: 0.39,
        alpha: 80.0,
    },
];

/// The note on E and ν of the steel rows.
pub const ELASTIC_SOURCE: &str = SHIGLEY_A5;

/// The built-in row with `key`.
#[must_use]
pub fn by_key(key: &str) -> Option<&'static TableMaterial> {
    TABLE.iter().find(|m| m.key == key)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_built_in_row_is_valid_and_keyed_once() {
        for (i, m) in TABLE.iter().enumerate() {
            assert!(m.strengths().is_ok(), "{}", m.name);
            assert!(m.e > 0.0 && m.nu > 0.0 && m.nu < 0.5, "{}", m.name);
            assert!(m.alpha > 1.0 && m.alpha < 200.0, "{}", m.name);
            assert!(!m.source.is_empty());
            assert!(TABLE[i + 1..].iter().all(|o| o.key != m.key), "{}", m.key);
        }
        assert!(by_key("gci30").is_some_and(|m| !m.strengths().unwrap().is_ductile()));
        assert!(by_key("1020hr").is_some_and(|m| m.strengths().unwrap().is_ductile()));
    }

    #[test]
    fn bad_data_is_refused_with_the_reason() {
        assert_eq!(
            Strengths::try_new(Some(300.0), -400.0, None, 20.0, None),
            Err(MaterialError::NotPositive("the ultimate tensile strength"))
        );
        assert_eq!(
            Strengths::try_new(Some(500.0), 400.0, None, 20.0, None),
            Err(MaterialError::YieldAboveUltimate)
        );
        assert_eq!(
            Strengths::try_new(None, 300.0, Some(200.0), 0.5, None),
            Err(MaterialError::CompressionBelowTension)
        );
        assert_eq!(
            Strengths::try_new(None, 300.0, None, 20.0, None),
            Err(MaterialError::DuctileNeedsYield)
        );
        assert_eq!(
            Strengths::try_new(Some(1.0), 2.0, None, f64::NAN, None),
            Err(MaterialError::Elongation)
        );
    }
}
