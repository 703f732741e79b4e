//! Stress and angle units with exact conversion factors.
//!
//! Factors to pascal: kPa 1e3, MPa 1e6, GPa 1e9 (SI prefixes); psi = lbf/in² with
//! 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N (exact by definition, NIST SP 811
//! appendix B) and 1 in = 0.0254 m (exact), giving 1 psi = 6894.757293168361 Pa; ksi = 1000 psi.

#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Pascals in one pound-force per square inch: 4.4482216152605 N / (0.0254 m)².
pub const PA_PER_PSI: f64 = 4.448_221_615_260_5 / (0.0254 * 0.0254);

/// A unit of stress (force per area).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum StressUnit {
    /// pascal, N/m².
    Pa,
    /// kilopascal.
    KPa,
    /// megapascal, N/mm².
    #[default]
    MPa,
    /// gigapascal.
    GPa,
    /// pound-force per square inch.
    Psi,
    /// kilo-pound-force per square inch.
    Ksi,
}

impl StressUnit {
    /// All units, in the order a selector lists them.
    pub const ALL: [StressUnit; 6] = [
        StressUnit::Pa,
        StressUnit::KPa,
        StressUnit::MPa,
        StressUnit::GPa,
        StressUnit::Psi,
        StressUnit::Ksi,
    ];

    /// (base unit in Pa, multiple of the base): SI units are multiples of the pascal, US
    /// customary ones of the psi, so conversions within a family are exact decimal shifts.
    fn base_and_multiple(self) -> (f64, f64) {
        match self {
            Self::Pa => (1.0, 1.0),
            Self::KPa => (1.0, 1e3),
            Self::MPa => (1.0, 1e6),
            Self::GPa => (1.0, 1e9),
            Self::Psi => (PA_PER_PSI, 1.0),
            Self::Ksi => (PA_PER_PSI, 1e3),
        }
    }

    /// Pascals in one of this unit.
    #[must_use]
    pub fn pascals(self) -> f64 {
        let (base, multiple) = self.base_and_multiple();
        base * multiple
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Pa => "Pa",
            Self::KPa => "kPa",
            Self::MPa => "MPa",
            Self::GPa => "GPa",
            Self::Psi => "psi",
            Self::Ksi => "ksi",
        }
    }

    /// Parses a symbol exactly as produced by [`symbol`](Self::symbol).
    #[must_use]
    pub fn from_symbol(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|u| u.symbol() == s)
    }

    /// Converts `value` given in `self` to `to`.
    #[must_use]
    pub fn convert(self, value: f64, to: StressUnit) -> f64 {
        let (from_base, from_mult) = self.base_and_multiple();
        let (to_base, to_mult) = to.base_and_multiple();
        if from_base == to_base {
            value * from_mult / to_mult
        } else {
            value * from_mult * from_base / to_base / to_mult
        }
    }
}

/// A unit of angle.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum AngleUnit {
    /// degrees, 360 to a turn.
    #[default]
    Degree,
    /// radians, 2π to a turn.
    Radian,
}

impl AngleUnit {
    /// Converts an angle in this unit to radians.
    #[must_use]
    pub fn to_radians(self, value: f64) -> f64 {
        match self {
            Self::Degree => value.to_radians(),
            Self::Radian => value,
        }
    }

    /// Converts an angle in radians to this unit.
    #[must_use]
    pub fn from_radians(self, radians: f64) -> f64 {
        match self {
            Self::Degree => radians.to_degrees(),
            Self::Radian => radians,
        }
    }

    /// The symbol shown beside numbers.
    #[must_use]
    pub fn symbol(self) -> &'static str {
        match self {
            Self::Degree => "°",
            Self::Radian => "rad",
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn psi_factor_is_the_exact_definition() {
        // NIST SP 811 (2008) appendix B.8 lists 1 psi = 6.894 757 E+03 Pa; the exact value follows
        // from the lbf and inch definitions.
        assert_eq!(PA_PER_PSI, 6894.757293168361);
        assert!((StressUnit::Ksi.pascals() - 6894757.293168361).abs() < 1e-8);
    }

    #[test]
    fn conversion_round_trips() {
        for a in StressUnit::ALL {
            for b in StressUnit::ALL {
                let x = 123.456;
                let back = b.convert(a.convert(x, b), a);
                assert!((back - x).abs() <= 1e-12 * x, "{a:?}->{b:?}");
            }
        }
        assert_eq!(StressUnit::MPa.convert(1.0, StressUnit::Pa), 1e6);
        assert_eq!(StressUnit::Ksi.convert(1.0, StressUnit::Psi), 1000.0);
    }

    #[test]
    fn symbols_parse_back() {
        for u in StressUnit::ALL {
            assert_eq!(StressUnit::from_symbol(u.symbol()), Some(u));
        }
        assert_eq!(StressUnit::from_symbol("bar"), None);
    }

    #[test]
    fn angles() {
        assert!((AngleUnit::Degree.to_radians(180.0) - core::f64::consts::PI).abs() < 1e-15);
        assert_eq!(AngleUnit::Radian.from_radians(1.0), 1.0);
    }
}
