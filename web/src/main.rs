//! The Stresscase page. `main` only mounts the app; everything else lives in the modules below.

mod app;
mod case;
mod entry;
mod numfmt;
mod panels;
mod plot;

fn main() {
    console_error_panic_hook::set_once();
    leptos::mount::mount_to_body(app::App);
}
