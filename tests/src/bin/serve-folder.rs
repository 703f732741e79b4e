//! Serves a folder on 127.0.0.1 (the built page, for `cargo xtask serve`).
//! Usage: serve-folder DIR [PORT]

use stresscase_tests::serve::StaticServer;

fn main() {
    let mut args = std::env::args().skip(1);
    let dir = args.next().unwrap_or_else(|| "dist".into());
    let port: u16 = args.next().and_then(|p| p.parse().ok()).unwrap_or(8080);
    match StaticServer::start_on(std::path::Path::new(&dir), "/", port) {
        Ok(s) => {
            eprintln!("serving {dir} on {} (Ctrl-C to stop)", s.url);
            loop {
                std::thread::park();
            }
        }
        Err(e) => {
            eprintln!("cannot serve on 127.0.0.1:{port}: {e}");
            std::process::exit(1);
        }
    }
}
