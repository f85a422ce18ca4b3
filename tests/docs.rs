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

/// Blocks of the guide that show a `channels.yaml` (first line
/// `# channels.yaml`) are valid channel profiles.
#[test]
fn every_channel_profile_example_in_the_guide_loads() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let guide = std::fs::read_to_string(root.join("docs/intents.md")).unwrap();
    let mut found = 0;
    let mut lines = guide.lines().enumerate().peekable();
    while let Some((i, line)) = lines.next() {
        if line.trim() != "```text"
            || lines.peek().map(|(_, l)| l.trim()) != Some("# channels.yaml")
        {
            continue;
        }
        let mut text = String::new();
        for (_, l) in lines.by_ref() {
            if l.trim_start().starts_with("```") {
                break;
            }
            text.push_str(l);
            text.push('\n');
        }
        let mut problems = Vec::new();
        let c = tidings::answers::channel::Channels::with_file("docs", &text, &mut problems);
        assert!(
            problems.is_empty(),
            "docs/intents.md line {}: {problems:?}",
            i + 2
        );
        assert!(c.names().len() > 4, "the example adds a channel");
        found += 1;
    }
    assert!(found >= 1, "the guide shows a channels.yaml");
}

/// Every operation, each of its outcomes and each fact it fills is
/// described in the operations reference (section 7), so an editor never
/// meets a fact the guide does not explain.
#[test]
fn every_operation_outcome_and_fact_is_in_the_reference() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let guide = std::fs::read_to_string(root.join("docs/intents.md")).unwrap();
    let start = guide
        .find("## 7. Operations reference")
        .expect("section 7 exists");
    let end = guide[start..].find("\n## 8.").map(|e| start + e).unwrap();
    let reference = &guide[start..end];
    let mut missing = Vec::new();
    for op in tidings::answers::ops::OPERATIONS {
        // The section of this operation: from its heading to the next one
        // (the three conversation basics share one heading).
        let name = format!("`{}`", op.name);
        let Some(from) = reference
            .match_indices("\n### ")
            .map(|(i, _)| i + 1)
            .find(|&i| reference[i..].lines().next().unwrap_or("").contains(&name))
        else {
            missing.push(format!("operation {}", op.name));
            continue;
        };
        let to = reference[from + 4..]
            .find("\n### ")
            .map(|e| from + 4 + e)
            .unwrap_or(reference.len());
        let section = &reference[from..to];
        for o in op.outcomes {
            if !section.contains(&format!("`{}`", o.name)) {
                missing.push(format!("{}: outcome {}", op.name, o.name));
            }
            for fact in o.facts {
                if !section.contains(&format!("`{fact}`"))
                    && !reference.contains(&format!("- `{fact}`"))
                {
                    missing.push(format!("{}: fact {fact} of outcome {}", op.name, o.name));
                }
            }
        }
        if !reference.contains(&format!("| `{}` |", op.name)) {
            missing.push(format!("{}: row of the summary table", op.name));
        }
    }
    assert!(
        missing.is_empty(),
        "not in docs/intents.md section 7: {missing:#?}"
    );
}

/// The `tidings check` summary the guides show (counts of competitors,
/// contests and intents) is what the demo prints, so the counts cannot
/// drift from the data and the intents.
#[test]
fn the_check_summary_in_the_guides_is_what_the_demo_prints() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_tidings"))
        .arg("check")
        .current_dir(root)
        .output()
        .expect("tidings check runs");
    assert!(out.status.success(), "tidings check fails on the demo");
    let printed = String::from_utf8(out.stdout).unwrap();
    let printed = printed.lines().next().unwrap_or("").to_string();
    assert!(printed.starts_with("ok: "), "{printed}");
    for guide in ["docs/api.md", "docs/intents.md"] {
        let text = std::fs::read_to_string(root.join(guide)).unwrap();
        let shown: Vec<&str> = text.lines().filter(|l| l.starts_with("ok: The ")).collect();
        assert!(!shown.is_empty(), "{guide} shows no check summary");
        for line in shown {
            assert_eq!(line, printed, "{guide}'s check summary");
        }
    }
}
