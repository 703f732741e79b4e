//! The Stresscase page. `main` only mounts the app.

fn main() {
    console_error_panic_hook::set_once();
    leptos::mount::mount_to_body(stresscase_web::app::App);
}
