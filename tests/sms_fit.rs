//! Every SMS reply fits one segment (3GPP TS 23.038 alphabet, TS 23.040
//! limits of 160 septets or 70 UCS-2 units), checked over every name in the
//! demo data: questions about each competitor, and each name asked as it
//! is, on the SMS channel.

mod common;

use tidings::answers::sms::measure;

#[tokio::test]
async fn every_sms_reply_about_every_competitor_fits_one_segment() {
    let engine = common::demo_engine();
    let snap = engine.snapshot();
    let names: Vec<String> = snap
        .data
        .competitors
        .iter()
        .map(|c| format!("{} {}", c.given, c.family))
        .collect();
    let mut checked = 0;
    for (i, name) in names.iter().enumerate() {
        for question in [
            format!("how did {name} do?"),
            format!("when does {name} compete next?"),
            name.clone(),
        ] {
            // A reader of their own per question, so no follow-up context.
            let reader = format!("sms-fit-{i}-{}", question.len());
            let a = engine.handle(&reader, "sms", &question).await.unwrap();
            let m = measure(&a.reply.text);
            assert!(
                m.fits_one_segment(),
                "{question:?}: {:?} is {} of {} units",
                a.reply.text,
                m.units,
                m.limit
            );
            let fit = a.sms.as_ref().expect("the sms channel reports its fit");
            assert_eq!((fit.units, fit.limit), (m.units, m.limit));
            checked += 1;
        }
    }
    assert!(checked >= 300, "{checked}");
}
