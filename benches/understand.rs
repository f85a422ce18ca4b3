//! Understanding one question on the demo data: normalising, finding names,
//! scoring intents. Run with `cargo bench --bench understand`.

use criterion::{criterion_group, criterion_main, Criterion};
use std::hint::black_box;

use tidings::engine::{self, Sources};

/// A mix of clean questions and the hard cases readers send.
const QUESTIONS: &[&str] = &[
    "who won the men's 100m?",
    "how many medals has Brellmoor won",
    "what's on tomorrow?",
    "how did Zoe do?",
    "who is leading the men's marathon",
    "did Galkase win the 100 metres",
    "tell me about Zoë Quillon",
    "who got bronze in the women's 200 m freestyle",
    "when is the women's one hundred meters final",
    "medal table",
    "how did kovendahl do in the single sculls",
    "best long jupm so far",
];

fn bench(c: &mut Criterion) {
    let snap = engine::load(&Sources::default()).expect("the demo loads");
    let today = jiff::civil::date(2027, 8, 14);
    let u = &snap.understanding;
    c.bench_function("understand/mix_of_12", |b| {
        b.iter(|| {
            for q in QUESTIONS {
                black_box(u.analyse(black_box(q), today));
            }
        })
    });
    // One benchmark per question: the median of these medians is the
    // figure the target is set on (see docs/performance.md).
    let mut g = c.benchmark_group("per_question");
    g.sample_size(20)
        .measurement_time(std::time::Duration::from_secs(1))
        .warm_up_time(std::time::Duration::from_millis(300));
    for (i, q) in QUESTIONS.iter().enumerate() {
        g.bench_function(format!("q{i:02}"), |b| {
            b.iter(|| black_box(u.analyse(black_box(q), today)))
        });
    }
    g.finish();
    c.bench_function("understand/clean_question", |b| {
        b.iter(|| black_box(u.analyse(black_box(QUESTIONS[0]), today)))
    });
    c.bench_function("understand/misspelt_question", |b| {
        b.iter(|| black_box(u.analyse(black_box(QUESTIONS[5]), today)))
    });
}

criterion_group!(benches, bench);
criterion_main!(benches);
