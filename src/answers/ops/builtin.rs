//! Conversation basics every scenario has: a greeting, a reply to thanks and
//! help that lists what can be asked. Editors still write their wording.

use super::*;

pub static GREETING: OpSpec = OpSpec {
    name: "greeting",
    summary: "a greeting",
    params: &[],
    outcomes: &[answered("answered", &["title", "topics"])],
    run: run_greeting,
};

pub static THANKS: OpSpec = OpSpec {
    name: "thanks",
    summary: "a reply to thanks",
    params: &[],
    outcomes: &[answered("answered", &["title"])],
    run: run_thanks,
};

pub static HELP: OpSpec = OpSpec {
    name: "help",
    summary: "what the reader can ask",
    params: &[],
    outcomes: &[answered("answered", &["title", "topics"])],
    run: run_help,
};

fn base(input: &OpInput) -> Facts {
    Facts::new()
        .set("title", input.data.scenario.title.as_str())
        .set("topics", Value::from(input.topics.to_vec()))
}

fn run_greeting(input: &OpInput) -> OpOutput {
    OpOutput::done("answered", base(input), vec![])
}

fn run_thanks(input: &OpInput) -> OpOutput {
    OpOutput::done(
        "answered",
        Facts::new().set("title", input.data.scenario.title.as_str()),
        vec![],
    )
}

fn run_help(input: &OpInput) -> OpOutput {
    OpOutput::done("answered", base(input), vec![])
}
