//! The batch principal-stress kernel (`principal::principal_values_into`) alone, built for
//! wasm32 with the page's profile, for the `page_kernel_speed` benchmark to time in headless
//! Chromium beside the same kernel natively on the same tensors. Not part of the page.
//!
//! Exports: `load(components)` takes the tensors' components (σx σy σz τxy τyz τzx per
//! tensor) and returns how many tensors were finite (the rest are skipped); `run()` works out
//! the principal values of all of them once and returns their sum, so nothing is optimised
//! away and the caller can check it against the native run (NaN if the kernel refused).
//!
//! Build: `cargo build -p stresscase-core --example batch_kernel --target wasm32-unknown-unknown
//! --profile wasm-release`, then `wasm-bindgen --target web` (the benchmark does both).

#[cfg(target_arch = "wasm32")]
mod exports {
    use std::cell::RefCell;
    use stresscase_core::principal::principal_values_into;
    use stresscase_core::StressTensor;
    use wasm_bindgen::prelude::wasm_bindgen;

    thread_local! {
        static BATCH: RefCell<(Vec<StressTensor>, Vec<[f64; 3]>)> = const { RefCell::new((Vec::new(), Vec::new())) };
    }

    /// Keeps the finite tensors among `components`; returns how many.
    #[wasm_bindgen]
    pub fn load(components: &[f64]) -> usize {
        let tensors: Vec<StressTensor> = components
            .chunks_exact(6)
            .filter_map(|c| StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).ok())
            .collect();
        let n = tensors.len();
        BATCH.with_borrow_mut(|b| *b = (tensors, vec![[0.0; 3]; n]));
        n
    }

    /// One pass of the kernel; the sum of every principal value.
    #[wasm_bindgen]
    pub fn run() -> f64 {
        BATCH.with_borrow_mut(|(tensors, out)| match principal_values_into(tensors, out) {
            Ok(()) => out.iter().flatten().sum(),
            Err(_) => f64::NAN,
        })
    }
}
