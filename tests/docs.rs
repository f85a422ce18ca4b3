//! Every complete example in the editors' guide is a valid intent file.

use std::path::Path;

fn yaml_blocks(markdown: &str) -> Vec<(usize, String)> {
    let mut out = Vec::new();
    let mut current: Option<(usize, String)> = None;
    for (i, line) in markdown.lines().enumerate() {
        match &mut current {
            None if line.trim_start().starts_with("```yaml") => {
                current = Some((i + 2, String::new()))
            }
            Some(_) if line.trim_start().starts_with("```") => {
                out.push(current.take().expect("inside a block"))
            }
            Some((_, text)) => {
                text.push_str(line);
                text.push('\n');
            }
            None => {}
        }
    }
    out
}

#[test]
fn every_yaml_example_in_the_intents_guide_loads() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let guide =
        std::fs::read_to_string(root.join("docs/intents.md")).expect("docs/intents.md exists");
    let blocks = yaml_blocks(&guide);
    assert!(
        blocks.len() >= 3,
        "the guide has at least three complete examples"
    );
    let service = std::fs::read_to_string(root.join("intents/games/service.yaml")).unwrap();
    for (line, text) in blocks {
        let files = vec![
            ("docs/intents.md".to_string(), text.clone()),
            ("service.yaml".to_string(), service.clone()),
        ];
        if let Err(e) = tidings::catalog::load_texts(&files) {
            panic!("the example at docs/intents.md line {line} does not load:\n{e}\n---\n{text}");
        }
    }
}
