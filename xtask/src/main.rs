//! `cargo xtask <command>`: every dev chore of Stresscase in one place.
//!
//! - `serve`: install what is missing, build and pack the page, serve `dist/` on
//!   http://127.0.0.1:8080
//! - `test`: install what is missing, then every check and test (formatting, lints, the no_std
//!   wasm32 build of core, unit/property/reference tests, the release build of the page, and the
//!   headless-Chromium tests against it)
//! - `build`: install what is missing, build the page and pack it into `dist/` (opens from disk
//!   too) and `target/stresscase-offline.zip`
//! - `bench`: the benchmarks, each beside its peer in the same run: principal values against
//!   numpy, a 1e6-row table natively and in the built page against pandas + numpy, keystrokes
//!   in the built page (installs numpy, pandas and Chromium if missing; builds the page)
//! - `refdata`: regenerate the 50-digit mpmath reference data (installs mpmath if missing)
//! - `fuzz [RUNS]`: libFuzzer on the case-link decoder, the saved-cases importer and the table
//!   reader, RUNS
//!   executions each (default 10 million; installs cargo-fuzz if missing)
//! - `setup`: only install what is missing
//!
//! Tools are pinned: trunk 0.21.14, wasm-bindgen-cli equal to the `wasm-bindgen` in Cargo.lock,
//! wasm-opt (binaryen) 132. Each is checked by its `--version` and installed only when absent or
//! different, so a second run is quick. Trunk runs with `--offline` and never downloads a tool.

mod pack;

use std::path::{Path, PathBuf};
use std::process::{Command, ExitCode};
use std::time::Instant;

const TRUNK_VERSION: &str = "0.21.14";
const WASM_OPT_VERSION: &str = "132";
const WASM_TARGET: &str = "wasm32-unknown-unknown";

type Result<T = ()> = std::result::Result<T, String>;

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let cmd = args.first().map_or("help", String::as_str);
    let started = Instant::now();
    let outcome = match cmd {
        "setup" => setup(false),
        "build" => setup(false).and_then(|()| build_page()),
        "serve" => setup(false).and_then(|()| serve()),
        "test" => test(),
        "bench" => bench(),
        "refdata" => refdata(),
        "fuzz" => fuzz(args.get(1).map_or("10000000", String::as_str)),
        _ => {
            eprintln!("usage: cargo xtask <serve|test|build|bench|refdata|fuzz [RUNS]|setup>");
            return ExitCode::from(2);
        }
    };
    match outcome {
        Ok(()) => {
            eprintln!(
                "xtask {cmd}: done in {:.0} s",
                started.elapsed().as_secs_f64()
            );
            ExitCode::SUCCESS
        }
        Err(e) => {
            eprintln!("xtask {cmd}: FAILED: {e}");
            ExitCode::FAILURE
        }
    }
}

fn root() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .parent()
        .map_or_else(|| PathBuf::from("."), Path::to_path_buf)
}

fn cargo() -> String {
    std::env::var("CARGO").unwrap_or_else(|_| "cargo".into())
}

/// Runs a command in the workspace root, streaming its output; fails on a non-zero exit.
fn run(program: &str, args: &[&str]) -> Result {
    run_env(program, args, &[])
}

fn run_env(program: &str, args: &[&str], env: &[(&str, &str)]) -> Result {
    eprintln!("xtask: $ {program} {}", args.join(" "));
    let status = Command::new(program)
        .args(args)
        .envs(env.iter().copied())
        .current_dir(root())
        .status()
        .map_err(|e| format!("cannot run {program}: {e}"))?;
    if status.success() {
        Ok(())
    } else {
        Err(format!(
            "`{program} {}` exited with {status}",
            args.join(" ")
        ))
    }
}

/// The first line a program prints for `args`, or None if it cannot be run.
fn output_of(program: &str, args: &[&str]) -> Option<String> {
    let out = Command::new(program).args(args).output().ok()?;
    out.status.success().then(|| {
        String::from_utf8_lossy(&out.stdout)
            .lines()
            .next()
            .unwrap_or("")
            .trim()
            .to_string()
    })
}

/// The version of `name` in Cargo.lock.
fn locked_version(name: &str) -> Result<String> {
    let lock = std::fs::read_to_string(root().join("Cargo.lock"))
        .map_err(|e| format!("Cargo.lock: {e}"))?;
    let needle = format!("name = \"{name}\"");
    let mut lines = lock.lines();
    while let Some(line) = lines.next() {
        if line.trim() == needle {
            if let Some(v) = lines
                .next()
                .and_then(|l| l.trim().strip_prefix("version = \""))
            {
                return Ok(v.trim_end_matches('"').to_string());
            }
        }
    }
    Err(format!("{name} is not in Cargo.lock"))
}

/// The value of `key = "…"` in Trunk.toml.
fn trunk_pin(key: &str) -> Result<String> {
    let text = std::fs::read_to_string(root().join("Trunk.toml"))
        .map_err(|e| format!("Trunk.toml: {e}"))?;
    text.lines()
        .filter_map(|l| l.split_once('='))
        .find(|(k, _)| k.trim() == key)
        .map(|(_, v)| v.trim().trim_matches('"').to_string())
        .ok_or_else(|| format!("Trunk.toml has no {key} pin"))
}

/// Installs whatever the build (and, with `browser`, the browser tests) needs and is missing.
fn setup(browser: bool) -> Result {
    let installed = Command::new("rustup")
        .args(["target", "list", "--installed"])
        .output()
        .is_ok_and(|o| {
            String::from_utf8_lossy(&o.stdout)
                .lines()
                .any(|l| l.trim() == WASM_TARGET)
        });
    if !installed {
        run("rustup", &["target", "add", WASM_TARGET])?;
    }

    let trunk = output_of("trunk", &["--version"]).unwrap_or_default();
    if trunk != format!("trunk {TRUNK_VERSION}") {
        eprintln!(
            "xtask: trunk {TRUNK_VERSION} missing (found {trunk:?}); installing (several minutes)"
        );
        run(
            &cargo(),
            &["install", "trunk", "--version", TRUNK_VERSION, "--locked"],
        )?;
    }

    let wbg = locked_version("wasm-bindgen")?;
    let pinned = trunk_pin("wasm_bindgen")?;
    if pinned != wbg {
        return Err(format!(
            "Trunk.toml pins wasm_bindgen = \"{pinned}\" but Cargo.lock has wasm-bindgen {wbg}; make them equal"
        ));
    }
    let have = output_of("wasm-bindgen", &["--version"]).unwrap_or_default();
    if have != format!("wasm-bindgen {wbg}") {
        eprintln!("xtask: wasm-bindgen-cli {wbg} missing (found {have:?}); installing");
        // Not --locked: one of its locked dependencies is no longer in the registry.
        run(
            &cargo(),
            &[
                "install",
                "wasm-bindgen-cli",
                "--version",
                &format!("={wbg}"),
            ],
        )?;
    }

    let opt_pin = trunk_pin("wasm_opt")?;
    if opt_pin != format!("version_{WASM_OPT_VERSION}") {
        return Err(format!(
            "Trunk.toml pins wasm_opt = \"{opt_pin}\", xtask installs version_{WASM_OPT_VERSION}"
        ));
    }
    let opt = output_of("wasm-opt", &["--version"]).unwrap_or_default();
    if !opt.contains(&format!("version {WASM_OPT_VERSION}")) {
        eprintln!("xtask: wasm-opt {WASM_OPT_VERSION} missing (found {opt:?}); installing binaryen from npm");
        run(
            "npm",
            &["install", "-g", &format!("binaryen@{WASM_OPT_VERSION}")],
        )?;
    }

    let missing_apt: Vec<&str> = [
        ("chromium", chromium().is_file()),
        ("poppler-utils", Path::new("/usr/bin/pdftotext").is_file()),
    ]
    .into_iter()
    .filter(|(_, present)| browser && !present)
    .map(|(name, _)| name)
    .collect();
    if !missing_apt.is_empty() {
        eprintln!(
            "xtask: {} missing; installing from Debian",
            missing_apt.join(", ")
        );
        run("apt-get", &["update"])?;
        let mut args = vec!["install", "-y"];
        args.extend(&missing_apt);
        run_env("apt-get", &args, &[("DEBIAN_FRONTEND", "noninteractive")])?;
    }
    if browser && !axe_script().is_file() {
        eprintln!("xtask: axe-core missing; installing it from npm into target/npm");
        let prefix = root().join("target/npm");
        std::fs::create_dir_all(&prefix).map_err(|e| e.to_string())?;
        run(
            "npm",
            &[
                "install",
                "--no-audit",
                "--no-fund",
                "--prefix",
                &prefix.to_string_lossy(),
                "axe-core@4",
            ],
        )?;
    }
    Ok(())
}

/// The accessibility rules the browser tests inject into the page (npm's axe-core).
fn axe_script() -> PathBuf {
    root().join("target/npm/node_modules/axe-core/axe.min.js")
}

fn chromium() -> PathBuf {
    std::env::var_os("CHROMIUM").map_or_else(|| PathBuf::from("/usr/bin/chromium"), PathBuf::from)
}

/// Builds the page with trunk and packs it into `dist/` and `target/stresscase-offline.zip`.
fn build_page() -> Result {
    run("trunk", &["build", "--release", "--offline"])?;
    let r = root();
    pack::pack(
        &r.join("target/trunk-dist"),
        &r.join("static/favicon.svg"),
        &r.join("dist"),
        &r.join("target/stresscase-offline.zip"),
    )
}

/// Builds and packs the page, then serves exactly the folder users get.
fn serve() -> Result {
    build_page()?;
    let dist = root().join("dist");
    run(
        &cargo(),
        &[
            "run",
            "--quiet",
            "-p",
            "stresscase-tests",
            "--bin",
            "serve-folder",
            "--",
            &dist.to_string_lossy(),
            "8080",
        ],
    )
}

fn test() -> Result {
    setup(true)?;
    let c = cargo();
    run(&c, &["fmt", "--all", "--", "--check"])?;
    run(
        &c,
        &[
            "clippy",
            "--workspace",
            "--all-targets",
            "--",
            "-D",
            "warnings",
        ],
    )?;
    // core must build for wasm32 without std (libm float functions), with and without serde.
    for features in [
        &["--no-default-features"][..],
        &["--no-default-features", "--features", "serde"][..],
    ] {
        let mut args = vec!["build", "-p", "stresscase-core", "--target", WASM_TARGET];
        args.extend_from_slice(features);
        run(&c, &args)?;
    }
    // The table tests compare with Python's csv module (standard library) and numpy; the life
    // tests with the `rainflow` and `fatpack` packages.
    for module in ["numpy", "rainflow", "fatpack"] {
        ensure_python_module(module)?;
    }
    run(&c, &["test", "--workspace"])?;
    build_page()?;
    let dist = root().join("dist");
    let dist = dist.to_string_lossy().into_owned();
    run_env(
        &c,
        &[
            "test",
            "-p",
            "stresscase-tests",
            "--test",
            "page_in_browser",
            "--test",
            "page_offline_and_links",
            "--test",
            "page_sources",
            "--test",
            "page_decision",
            "--test",
            "page_trust",
            "--test",
            "page_sheet",
            "--test",
            "page_table",
            "--test",
            "page_life",
            "--",
            "--ignored",
            "--test-threads=2",
        ],
        &[("STRESSCASE_DIST", &dist)],
    )
}

fn ensure_python_module(module: &str) -> Result {
    let ok = Command::new("python3")
        .args(["-c", &format!("import {module}")])
        .status()
        .is_ok_and(|s| s.success());
    if !ok {
        run("python3", &["-m", "pip", "install", module])?;
    }
    Ok(())
}

/// The native benchmarks, then the built page's (built first; Chromium installed if missing):
/// each prints its figures beside its named peer's from the same run.
fn bench() -> Result {
    for module in ["numpy", "pandas", "rainflow"] {
        ensure_python_module(module)?;
    }
    for bench in ["principal_speed", "table_speed", "rainflow_speed"] {
        run(
            &cargo(),
            &["bench", "-p", "stresscase-tests", "--bench", bench],
        )?;
    }
    setup(true)?;
    build_page()?;
    // Lighthouse from npm, for the page's scores (the benchmark says so if it is missing).
    if Command::new("lighthouse")
        .arg("--version")
        .output()
        .is_err()
    {
        run("npm", &["install", "-g", "lighthouse"])?;
    }
    let dist = root().join("dist").display().to_string();
    for bench in [
        "page_start",
        "page_lighthouse",
        "page_table_speed",
        "page_kernel_speed",
        "page_keystroke",
        "page_life_speed",
    ] {
        run_env(
            &cargo(),
            &["bench", "-p", "stresscase-tests", "--bench", bench],
            &[("STRESSCASE_DIST", &dist)],
        )?;
    }
    Ok(())
}

fn refdata() -> Result {
    ensure_python_module("mpmath")?;
    let out = Command::new("python3")
        .arg(root().join("tests/data/gen_principal_mp50.py"))
        .output()
        .map_err(|e| format!("python3: {e}"))?;
    if !out.status.success() {
        return Err(String::from_utf8_lossy(&out.stderr).into_owned());
    }
    std::fs::write(root().join("tests/data/principal_mp50.csv"), out.stdout)
        .map_err(|e| e.to_string())
}

/// Runs each fuzz target for `runs` executions, starting from the seeds in `web/fuzz/seeds/`.
/// cargo-fuzz needs unstable compiler flags; `RUSTC_BOOTSTRAP=1` allows them on stable Rust for
/// this command only.
fn fuzz(runs: &str) -> Result {
    if runs.parse::<u64>().is_err() {
        return Err(format!("RUNS must be a whole number, not {runs:?}"));
    }
    if output_of(&cargo(), &["fuzz", "--version"]).is_none() {
        run(&cargo(), &["install", "cargo-fuzz", "--locked"])?;
    }
    let r = root();
    for target in [
        "link_decoder",
        "saved_import",
        "table_reader",
        "table_number",
    ] {
        let corpus = r.join("web/fuzz/corpus").join(target);
        std::fs::create_dir_all(&corpus).map_err(|e| e.to_string())?;
        let seeds = r.join("web/fuzz/seeds").join(target);
        run_env(
            &cargo(),
            &[
                "fuzz",
                "run",
                "--fuzz-dir",
                "web/fuzz",
                target,
                &corpus.to_string_lossy(),
                &seeds.to_string_lossy(),
                "--",
                &format!("-runs={runs}"),
                "-max_len=16384",
                "-print_final_stats=1",
            ],
            &[("RUSTC_BOOTSTRAP", "1")],
        )?;
    }
    Ok(())
}
