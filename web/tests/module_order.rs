//! The page's modules import one way: no import cycle between the modules of `web/src`
//! (`model::entry`, `model::source`, `formats::link`, `panels`, ...). Test code is left out: a
//! test may reach anywhere. Each file's code before its first `#[cfg(test)]` is scanned for
//! `crate::` paths.

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};

/// The node a file belongs to: `model`/`formats` files by their own module (a path's
/// submodules count as the path), everything else by its top folder.
fn node_of(rel: &Path) -> Option<String> {
    let parts: Vec<String> = rel
        .with_extension("")
        .components()
        .map(|c| c.as_os_str().to_string_lossy().into_owned())
        .collect();
    match parts.as_slice() {
        [top, module, ..] if (top == "model" || top == "formats") && module != "mod" => {
            Some(format!("{top}::{module}"))
        }
        [top, ..] if top == "lib" || top == "main" => None,
        [top, ..] => Some(top.clone()),
        [] => None,
    }
}

/// The node a `crate::` path names.
fn node_of_path(path: &str) -> String {
    let mut it = path.split("::");
    let top = it.next().unwrap_or_default();
    match (top, it.next()) {
        ("model" | "formats", Some(m)) if m.chars().all(|c| c.is_ascii_lowercase() || c == '_') => {
            format!("{top}::{m}")
        }
        _ => top.to_string(),
    }
}

fn files(dir: &Path, out: &mut Vec<PathBuf>) {
    for entry in std::fs::read_dir(dir).expect("read web/src") {
        let p = entry.expect("entry").path();
        if p.is_dir() {
            files(&p, out);
        } else if p.extension().is_some_and(|e| e == "rs") {
            out.push(p);
        }
    }
}

fn graph() -> BTreeMap<String, BTreeSet<String>> {
    let src = Path::new(env!("CARGO_MANIFEST_DIR")).join("src");
    let mut all = Vec::new();
    files(&src, &mut all);
    let mut g: BTreeMap<String, BTreeSet<String>> = BTreeMap::new();
    for f in all {
        let rel = f.strip_prefix(&src).expect("under src");
        if rel.file_name().is_some_and(|n| n == "tests.rs") {
            continue;
        }
        let Some(node) = node_of(rel) else { continue };
        let text = std::fs::read_to_string(&f).expect("read file");
        let code = text.split("#[cfg(test)]").next().unwrap_or_default();
        let deps = g.entry(node.clone()).or_default();
        for (i, _) in code.match_indices("crate::") {
            let rest: String = code[i + 7..]
                .chars()
                .take_while(|c| c.is_ascii_alphanumeric() || *c == '_' || *c == ':')
                .collect();
            let dep = node_of_path(&rest);
            if dep != node && !dep.is_empty() {
                deps.insert(dep);
            }
        }
    }
    g
}

/// A cycle through `n`, if the graph has one reachable from it.
fn cycle_from(
    n: &str,
    g: &BTreeMap<String, BTreeSet<String>>,
    stack: &mut Vec<String>,
    done: &mut BTreeSet<String>,
) -> Option<Vec<String>> {
    if let Some(at) = stack.iter().position(|s| s == n) {
        let mut c = stack[at..].to_vec();
        c.push(n.to_string());
        return Some(c);
    }
    if done.contains(n) {
        return None;
    }
    stack.push(n.to_string());
    for d in g.get(n).into_iter().flatten() {
        if let Some(c) = cycle_from(d, g, stack, done) {
            return Some(c);
        }
    }
    stack.pop();
    done.insert(n.to_string());
    None
}

#[test]
fn no_module_imports_one_that_imports_it_back() {
    let g = graph();
    // The scan sees the model's modules and the page's groups.
    for n in [
        "model::inputs",
        "model::source",
        "model::case",
        "formats::link",
        "panels",
    ] {
        assert!(g.contains_key(n), "{n} not found in {:?}", g.keys());
    }
    assert!(g["model::case"].contains("model::source"));
    let mut done = BTreeSet::new();
    for n in g.keys() {
        let cycle = cycle_from(n, &g, &mut Vec::new(), &mut done);
        assert!(
            cycle.is_none(),
            "import cycle: {}",
            cycle.unwrap_or_default().join(" → ")
        );
    }
}

#[test]
fn the_model_does_not_reach_the_page() {
    let g = graph();
    for (n, deps) in &g {
        if n.starts_with("model::") || n.starts_with("formats::") {
            for d in deps {
                assert!(
                    d.starts_with("model::")
                        || (n.starts_with("formats::") && d.starts_with("formats::")),
                    "{n} imports {d}"
                );
            }
        }
    }
}
