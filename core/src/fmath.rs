//! The float functions core needs, in one place: the standard library's with the `std` feature,
//! `libm`'s without it. Nothing else in core calls a float function directly.

macro_rules! shim {
    ($(#[$doc:meta] $name:ident($($arg:ident),+))+) => {$(
        #[$doc]
        #[inline]
        #[must_use]
        pub fn $name($($arg: f64),+) -> f64 {
            #[cfg(feature = "std")]
            { f64::$name($($arg),+) }
            #[cfg(not(feature = "std"))]
            { libm::$name($($arg),+) }
        }
    )+};
}

shim! {
    /// Square root.
    sqrt(x)
    /// Sine of an angle in radians.
    sin(x)
    /// Cosine of an angle in radians.
    cos(x)
    /// Four-quadrant arctangent of y/x, in (−π, π].
    atan2(y, x)
    /// Arccosine, in [0, π].
    acos(x)
    /// √(x² + y²) without undue overflow or underflow.
    hypot(x, y)
    /// e to the power x.
    exp(x)
    /// Hyperbolic tangent.
    tanh(x)
    /// Base-10 logarithm.
    log10(x)
    /// Largest integer not above x.
    floor(x)
    /// Smallest integer not below x.
    ceil(x)
}

/// The larger of `a` and `b`; a NaN is passed over, as [`f64::max`] does. Written as a
/// comparison because on wasm32 `f64::max` is a call to `fmax` for each number, even in a loop
/// the compiler has put in vector lanes; the comparison stays in the lanes.
#[inline(always)]
#[must_use]
pub fn max(a: f64, b: f64) -> f64 {
    if a > b || b.is_nan() {
        a
    } else {
        b
    }
}

/// The smaller of `a` and `b`; a NaN is passed over, as [`f64::min`] does (see [`max`]).
#[inline(always)]
#[must_use]
pub fn min(a: f64, b: f64) -> f64 {
    if a < b || b.is_nan() {
        a
    } else {
        b
    }
}

/// `x` wrapped into [0, period) (the Euclidean remainder, which `core` lacks for floats).
#[inline]
#[must_use]
pub fn wrap(x: f64, period: f64) -> f64 {
    let r = x % period;
    if r < 0.0 {
        r + period
    } else {
        r
    }
}

/// x raised to the power y.
#[inline]
#[must_use]
pub fn powf(x: f64, y: f64) -> f64 {
    #[cfg(feature = "std")]
    {
        f64::powf(x, y)
    }
    #[cfg(not(feature = "std"))]
    {
        libm::pow(x, y)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    /// Any f64 bit pattern: normal, subnormal, ±0, ±∞ and NaNs of every payload.
    fn any_bits() -> impl Strategy<Value = f64> {
        prop_oneof![
            any::<u64>().prop_map(f64::from_bits),
            Just(f64::NAN),
            Just(0.0),
            Just(-0.0),
            Just(f64::INFINITY),
            Just(f64::NEG_INFINITY),
        ]
    }

    /// Equal as `f64::max`/`min` promise: the same number, or both NaN; ±0 may come either way.
    fn same(a: f64, b: f64) -> bool {
        (a.is_nan() && b.is_nan()) || a == b
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(4096))]

        #[test]
        fn max_and_min_agree_with_the_standard_library(a in any_bits(), b in any_bits()) {
            prop_assert!(same(max(a, b), a.max(b)), "max({a}, {b}) = {}", max(a, b));
            prop_assert!(same(min(a, b), a.min(b)), "min({a}, {b}) = {}", min(a, b));
        }
    }
}
