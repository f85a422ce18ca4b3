//! Embeds the demo intents folder into the binary, whatever files it holds,
//! so adding an intent to the demo needs no code change.

use std::fs;
use std::path::Path;

fn main() {
    let dir = Path::new("intents/games");
    println!("cargo:rerun-if-changed={}", dir.display());
    let mut names: Vec<String> = fs::read_dir(dir)
        .map(|rd| {
            rd.flatten()
                .map(|e| e.file_name().to_string_lossy().into_owned())
                .filter(|n| n.ends_with(".yaml"))
                .collect()
        })
        .unwrap_or_default();
    names.sort();
    let manifest = std::env::var("CARGO_MANIFEST_DIR").expect("cargo sets CARGO_MANIFEST_DIR");
    let mut out = String::from("pub const INTENTS: &[(&str, &str)] = &[\n");
    for n in &names {
        println!("cargo:rerun-if-changed=intents/games/{n}");
        out.push_str(&format!(
            "    ({n:?}, include_str!({:?})),\n",
            format!("{manifest}/intents/games/{n}")
        ));
    }
    out.push_str("];\n");
    let dest =
        Path::new(&std::env::var("OUT_DIR").expect("cargo sets OUT_DIR")).join("demo_intents.rs");
    fs::write(dest, out).expect("OUT_DIR is writable");
}
