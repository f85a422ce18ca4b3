//! External checks of computed tables: published final tables recomputed
//! by the engine from their match results with their tie-breakers.

use tidings::dataset::{load_files, Dataset};

/// A scenario of one group of national sides and its six matches, as
/// `(home, away, home goals, away goals)`, with the table's order of keys.
fn group(teams: &[(&str, &str)], matches: &[(&str, &str, u32, u32)], order: &str) -> Dataset {
    let groups: Vec<String> = teams
        .iter()
        .map(|(id, name)| format!(r#"{{"id":"{id}","name":"{name}"}}"#))
        .collect();
    let contests: Vec<String> = matches
        .iter()
        .enumerate()
        .map(|(i, (h, a, hs, as_))| {
            format!(
                r#"{{"id":"m{}","sport":"football","discipline":"group","phase":"match","round":"matchday {}","start":"2012-06-{:02}T18:00","status":"final","measure":"score","entries":[{{"group":"{h}","side":"home","mark":"{hs}"}},{{"group":"{a}","side":"away","mark":"{as_}"}}]}}"#,
                i + 1,
                i / 2 + 1,
                8 + i
            )
        })
        .collect();
    let scenario = format!(
        r#"{{"id":"g","title":"Group","time_zone":"Europe/Warsaw","as_of":"2012-06-17T23:00:00+02:00","score_unit":"goal","tables":[{{"id":"group","name":"Group table","count":"results","order":{order}}}]}}"#
    );
    let sports = r#"[{"id":"football","name":"football","noun":"player","disciplines":[{"id":"group","name":"group stage"}]}]"#;
    let files = [
        ("scenario.json", scenario),
        ("sports.json", sports.to_string()),
        ("groups.json", format!("[{}]", groups.join(","))),
        ("competitors.json", "[]".to_string()),
        ("contests.json", format!("[{}]", contests.join(","))),
    ];
    load_files(&|name: &str| {
        let text = files.iter().find(|(n, _)| *n == name).unwrap().1.clone();
        Ok((name.to_string(), text))
    })
    .expect("the group loads")
}

/// (name, place, played, won, drawn, lost, scored, conceded, points)
type Line = (&'static str, u32, u32, u32, u32, u32, u64, u64, i64);

fn lines(d: &Dataset) -> Vec<Line> {
    let t = d.table("group").unwrap();
    t.rows
        .iter()
        .map(|r| {
            let name: &'static str = Box::leak(d.groups[r.group].name.clone().into_boxed_str());
            (
                name, r.rank, r.played, r.won, r.drawn, r.lost, r.scored, r.conceded, r.points,
            )
        })
        .collect()
}

/// Source: the final table of UEFA Euro 2012 Group A and its six results
/// (from memory). The competition's tie-breakers put head-to-head before
/// goal difference: Greece finish above Russia, who have the better goal
/// difference, because Greece won their meeting 1–0; the Czech Republic
/// top the group with a negative goal difference.
#[test]
fn a_published_group_table_with_head_to_head_first_is_recomputed() {
    let d = group(
        &[
            ("pol", "Poland"),
            ("gre", "Greece"),
            ("rus", "Russia"),
            ("cze", "Czech Republic"),
        ],
        &[
            ("pol", "gre", 1, 1),
            ("rus", "cze", 4, 1),
            ("gre", "cze", 1, 2),
            ("pol", "rus", 1, 1),
            ("cze", "pol", 1, 0),
            ("gre", "rus", 1, 0),
        ],
        r#"["points","head_to_head","difference","scored"]"#,
    );
    assert_eq!(
        lines(&d),
        vec![
            ("Czech Republic", 1, 3, 2, 0, 1, 4, 5, 6),
            ("Greece", 2, 3, 1, 1, 1, 3, 3, 4),
            ("Russia", 3, 3, 1, 1, 1, 5, 3, 4),
            ("Poland", 4, 3, 0, 2, 1, 2, 3, 2),
        ]
    );
    // With goal difference before head-to-head, Russia would be second.
    let d = group(
        &[
            ("pol", "Poland"),
            ("gre", "Greece"),
            ("rus", "Russia"),
            ("cze", "Czech Republic"),
        ],
        &[
            ("pol", "gre", 1, 1),
            ("rus", "cze", 4, 1),
            ("gre", "cze", 1, 2),
            ("pol", "rus", 1, 1),
            ("cze", "pol", 1, 0),
            ("gre", "rus", 1, 0),
        ],
        r#"["points","difference","scored","head_to_head"]"#,
    );
    assert_eq!(lines(&d)[1].0, "Russia");
}

/// Source: the final table of the 2018 FIFA World Cup Group H and its six
/// results (from memory). Japan and Senegal are level on points, goal
/// difference, goals scored and their meeting (2–2); the published table
/// separates them by disciplinary points, which results do not hold, so on
/// the results' tie-breakers alone they share second place and the next
/// place is fourth (standard competition ranking).
#[test]
fn sides_level_on_every_results_tie_breaker_share_a_place() {
    let d = group(
        &[
            ("col", "Colombia"),
            ("jpn", "Japan"),
            ("sen", "Senegal"),
            ("pol", "Poland"),
        ],
        &[
            ("col", "jpn", 1, 2),
            ("pol", "sen", 1, 2),
            ("jpn", "sen", 2, 2),
            ("pol", "col", 0, 3),
            ("jpn", "pol", 0, 1),
            ("sen", "col", 0, 1),
        ],
        r#"["points","difference","scored","head_to_head"]"#,
    );
    assert_eq!(
        lines(&d),
        vec![
            ("Colombia", 1, 3, 2, 0, 1, 5, 2, 6),
            ("Japan", 2, 3, 1, 1, 1, 4, 4, 4),
            ("Senegal", 2, 3, 1, 1, 1, 4, 4, 4),
            ("Poland", 4, 3, 1, 0, 2, 2, 5, 3),
        ]
    );
}

/// The JSON examples of docs/data-league.md parse as what they show: table
/// rules that load, contests identical to the league demo's records of the
/// same id, and a batch the admin API accepts the shape of.
#[test]
fn the_examples_in_the_league_data_reference_parse() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let doc = std::fs::read_to_string(root.join("docs/data-league.md")).unwrap();
    let blocks: Vec<&str> = doc
        .split("```json\n")
        .skip(1)
        .map(|b| b.split("```").next().unwrap())
        .collect();
    assert_eq!(blocks.len(), 3, "three JSON examples");
    let tables: serde_json::Value = serde_json::from_str(&format!("{{{}}}", blocks[0])).unwrap();
    let rules: Vec<tidings::dataset::table::TableRule> =
        serde_json::from_value(tables["tables"].clone()).unwrap();
    assert_eq!(rules.len(), 3);
    let demo: Vec<serde_json::Value> = serde_json::from_str(
        &std::fs::read_to_string(root.join("dataset-demo/league/contests.json")).unwrap(),
    )
    .unwrap();
    let shown: Vec<serde_json::Value> = serde_json::from_str(blocks[1]).unwrap();
    for c in &shown {
        let _: tidings::dataset::Contest = serde_json::from_value(c.clone()).unwrap();
        let same = demo
            .iter()
            .find(|d| d["id"] == c["id"])
            .expect("in the demo");
        assert_eq!(same, c, "the example of {} is the demo's record", c["id"]);
    }
    let _: tidings::dataset::changes::Batch = serde_json::from_str(blocks[2]).unwrap();
    // The league rule in the reference is the demo's own.
    let scenario: serde_json::Value = serde_json::from_str(
        &std::fs::read_to_string(root.join("dataset-demo/league/scenario.json")).unwrap(),
    )
    .unwrap();
    assert_eq!(scenario["tables"][0], tables["tables"][0]);
}
