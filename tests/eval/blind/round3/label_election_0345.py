#!/usr/bin/env python3
"""Blind question set for the election scenario at 03:45.

Reads dataset-demo/election/, applies every replay batch up to
2027-05-07T03:45+01:00, and writes election-0345.yaml next to this script.
Every expected fact is computed from the data; the questions and the
meaning intended for each are held below as data.
"""
import glob
import json
import math
import os
from datetime import datetime

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))
MOMENT = datetime.fromisoformat("2027-05-07T03:45:00+01:00")
OUT = os.path.join(HERE, "election-0345.yaml")


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


COMP = {c["id"]: c for c in load("competitors.json")}
GROUPS = {g["id"]: g for g in load("groups.json")}
CONTESTS = {c["id"]: c for c in load("contests.json")}
SPORTS = load("sports.json")
WARD_NAMES = {d["id"]: d["name"] for s in SPORTS for d in s["disciplines"]}

# history of every batch, to find stale figures for `never`
HISTORY = {cid: [] for cid in CONTESTS}
for path in sorted(glob.glob(os.path.join(DATA, "replay", "*.json"))):
    with open(path, encoding="utf-8") as f:
        batch = json.load(f)
    if datetime.fromisoformat(batch["as_of"]) > MOMENT:
        continue
    for ch in batch["changes"]:
        if ch["change"] != "results":
            continue
        c = CONTESTS[ch["contest"]]
        for k in ("status", "entries", "counted", "updated"):
            if k in ch:
                c[k] = ch[k]
        HISTORY[ch["contest"]].append(json.loads(json.dumps(ch)))


# ---------------------------------------------------------------- helpers
def name(cid):
    c = COMP[cid]
    return f"{c['given']} {c['family']}"


def gname(gid):
    return GROUPS[gid]["name"]


def wname(wid):
    return WARD_NAMES[wid]


def votes_of(entry):
    return int(entry["mark"].replace(",", ""))


def fmt(n):
    return f"{n:,}"


WORDS = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


def count_word(n):
    return WORDS[n] if 0 <= n <= 9 else str(n)


def ordinal(n):
    suf = "th" if 10 <= n % 100 <= 20 else {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def ranked(wid):
    c = CONTESTS[wid]
    return sorted(c["entries"], key=lambda e: e["place"])


def final(wid):
    return CONTESTS[wid]["status"] == "final"


def winner(wid):
    for e in ranked(wid):
        if e.get("award") == "seat":
            return e["competitor"]
    return None


def leader(wid):
    return ranked(wid)[0]["competitor"]


def margin(wid):
    r = ranked(wid)
    return votes_of(r[0]) - votes_of(r[1])


def ward_of(cid):
    for wid, c in CONTESTS.items():
        for e in c["entries"]:
            if e["competitor"] == cid:
                return wid
    raise KeyError(cid)


def entry_of(cid):
    wid = ward_of(cid)
    for e in CONTESTS[wid]["entries"]:
        if e["competitor"] == cid:
            return e
    raise KeyError(cid)


def at_place(wid, n):
    for e in ranked(wid):
        if e["place"] == n:
            return e["competitor"]
    return None


def party_cand(gid, wid):
    for e in CONTESTS[wid]["entries"]:
        if COMP[e["competitor"]]["group"] == gid:
            return e["competitor"]
    return None


def counted_pct(wid):
    return f"{math.floor(CONTESTS[wid].get('counted', 0) * 100 + 1e-9)}%"


def seats():
    tally = {g: 0 for g in GROUPS}
    for wid in CONTESTS:
        w = winner(wid)
        if w and final(wid):
            tally[COMP[w]["group"]] += 1
    return sorted(tally.items(), key=lambda kv: (-kv[1], GROUPS[kv[0]]["name"]))


def open_wards():
    return [w for w, c in CONTESTS.items() if c["status"] != "final"]


def stale_marks(wid, batches_back=1):
    """Vote figures from the last earlier batch that no longer appear."""
    hist = HISTORY[wid]
    if len(hist) <= batches_back:
        return []
    old = hist[-1 - batches_back]
    now = {e["mark"] for e in CONTESTS[wid]["entries"]}
    now |= {fmt(margin(wid))}
    return [e["mark"] for e in old["entries"] if e["mark"] not in now]


def stale_pct(wid, batches_back=1):
    hist = HISTORY[wid]
    if len(hist) <= batches_back:
        return []
    old = hist[-1 - batches_back]
    p = f"{math.floor(old['counted'] * 100 + 1e-9)}%"
    return [p] if p != counted_pct(wid) else []


# ------------------------------------------------------------ turn makers
# Each maker takes the question and its intended meaning, computes the
# expected facts and returns one turn (a dict in the brief's format).

def T(ask, intent, slots, outcome, focus, says=None, never=None, tags=()):
    t = {"ask": ask}
    if intent is not None:
        t["intent"] = intent
    if slots is not None and intent not in (None, "none"):
        t["slots"] = slots
    if outcome is not None:
        t["outcome"] = outcome
    t["focus"] = focus
    if says:
        t["says"] = list(says)
    if never:
        nv = [n for n in never if not any(n.lower() in s.lower() for s in (says or []))]
        if nv:
            t["never"] = nv
    t["_tags"] = list(tags)
    return t


def winner_t(ask, wid, tags=(), focus="who", never=()):
    assert final(wid)
    return T(ask, "ward_winner", {"contest": wid}, "answered", focus, [name(winner(wid))],
             list(never), tags)


def leader_t(ask, wid, tags=(), focus="who", never=()):
    return T(ask, "ward_leader", {"contest": wid}, "answered", focus,
             [name(leader(wid)), fmt(margin(wid))], list(never) + stale_marks(wid), tags)


def place_t(ask, wid, n, tags=(), focus="who"):
    cid = at_place(wid, n)
    slots = {"contest": wid, "place": str(n)}
    if cid is None:
        return T(ask, "ward_place", slots, "no_data", focus, None,
                 [name(ranked(wid)[-1]["competitor"])], tags)
    return T(ask, "ward_place", slots, "answered", focus, [name(cid)], None, tags)


def results_t(ask, wid, tags=(), focus="results", top=None):
    r = ranked(wid)
    if top:
        r = r[:top]
    says = []
    for e in r:
        says += [name(e["competitor"]), e["mark"]]
    return T(ask, "ward_results", {"contest": wid}, "answered", focus, says,
             stale_marks(wid), tags)


def progress_t(ask, wid, tags=(), focus="status"):
    return T(ask, "count_progress", {"contest": wid}, "answered", focus, [counted_pct(wid)],
             stale_pct(wid), tags)


def cresult_t(ask, cid, wid=None, tags=(), focus="whether", votes=False):
    slots = {"competitor": cid}
    if wid:
        slots["contest"] = wid
    says = [name(cid), wname(ward_of(cid))]
    if votes:
        says.append(entry_of(cid)["mark"])
    return T(ask, "candidate_result", slots, "answered", focus, says, None, tags)


def cmargin_t(ask, cid, wid=None, tags=(), focus="margin", slots=True):
    w = ward_of(cid)
    assert wid in (None, w)
    e = entry_of(cid)
    win = winner(w)
    if cid == win:
        says = [fmt(margin(w))]
    else:
        assert e["place"] == 2, "margins only for winners and runners-up"
        says = [fmt(margin(w)), name(win)]
    s = {"competitor": cid}
    if wid:
        s["contest"] = wid
    return T(ask, "candidate_margin", s if slots else None, "answered", focus, says,
             stale_marks(w), tags)


def cparty_t(ask, cid, tags=(), focus="group_of"):
    return T(ask, "candidate_party", {"competitor": cid}, "answered", focus,
             [gname(COMP[cid]["group"]), wname(ward_of(cid))], None, tags)


def compare_t(ask, cid, rival, wid=None, tags=(), focus="compare"):
    a, b = entry_of(cid), entry_of(rival)
    assert ward_of(cid) == ward_of(rival)
    ahead = cid if a["place"] < b["place"] else rival
    slots = {"competitor": cid, "rival": rival}
    if wid:
        slots["contest"] = wid
    return T(ask, "candidates_compared", slots, "answered", focus, [name(ahead)], None, tags)


def pward_t(ask, gid, wid, tags=(), focus="how_did", votes=True):
    cid = party_cand(gid, wid)
    slots = {"group": gid, "contest": wid}
    if cid is None:
        # the party stood nobody there: leave the outcome unchecked
        return T(ask, "party_in_ward", slots, None, focus, None, None, tags)
    says = [name(cid)] + ([entry_of(cid)["mark"]] if votes else [])
    return T(ask, "party_in_ward", slots, "answered", focus, says, None, tags)


def pseats_t(ask, gid, tags=(), focus="count"):
    n = dict(seats())[gid]
    return T(ask, "party_seats", {"group": gid}, "answered", focus, [count_word(n)], None, tags)


def totals_t(ask, n=None, tags=(), focus="table", slots=True, never=True):
    rows = seats()
    shown = rows[:n] if n else [r for r in rows if r[1] > 0]
    if n:
        assert rows[n - 1][1] > rows[n][1], "top-n must not cut a tie"
    says = []
    for g, k in shown:
        says += [gname(g), count_word(k)]
    never = [gname(g) for g, _ in rows[n:]] if (n and never) else []
    s = ({"count": str(n)} if n else {}) if slots else None
    return T(ask, "seat_totals", s, "answered", focus, says, never, tags)


def open_t(ask, tags=(), focus="open"):
    ow = open_wards()
    return T(ask, "open_races", {}, "answered", focus, [wname(w) for w in ow], None, tags)


def chat_t(ask, intent, tags=()):
    return T(ask, intent, {}, "answered", "chat", None, None, tags)


def none_t(ask, focus="other", never=(), tags=(), outcome="not_covered"):
    tg = list(tags) + (["uncovered"] if outcome == "not_covered" else [])
    return T(ask, "none", None, outcome, focus, None, list(never), tg)


def clarify_t(ask, intent, slots, options, focus, tags=()):
    return T(ask, intent, slots, "clarify", focus, options, None, list(tags) + ["clarify"])


def nodata_t(ask, intent, slots, focus, never=(), tags=()):
    return T(ask, intent, slots, "no_data", focus, None, list(never), list(tags) + ["uncovered"])


def raw_t(ask, intent, slots, outcome, focus, says=None, never=None, tags=()):
    return T(ask, intent, slots, outcome, focus, says, never, tags)


ASH = [wname("ashvenny-north"), wname("ashvenny-south")]
BRANNICK = [name("c07"), name("c35")]
assert COMP["c07"]["family"] == COMP["c35"]["family"]

# ------------------------------------------------------------------ cases
SINGLES = [
    winner_t("who won marrowby", "marrowby", ["exact", "voice"]),
    winner_t("Who took the Brindle Quay seat?", "brindle-quay", ["exact"]),
    winner_t("brindle key winner", "brindle-quay", ["voice", "mishearing"]),
    progress_t("how much of wrenlow has been counted", "wrenlow-sands", ["partial", "voice"]),
    leader_t("whos ahead in quellan cross", "quellan-cross", ["contraction"]),
    results_t("gorsevane full result pls", "gorsevane", ["exact"]),
    place_t("who came 3rd in lanmouth", "lanmouth", 3, ["constraint"]),
    place_t("who finished second in the sands", "wrenlow-sands", 2, ["partial", "number_words"]),
    cparty_t("what party is orla quenlow", "c01", ["exact"]),
    cresult_t("Did Kesia Carravine win?", "c36", tags=["exact"]),
    cresult_t("has sabeth pellagan held on", "c05", tags=["voice"]),
    pseats_t("how many seats have the greens got", "greens", ["partial"]),
    totals_t("seat totals", tags=["exact"]),
    open_t("which races are still undecided", ["exact"]),
    pward_t("how did lantern do in brindle", "lantern", "brindle-quay", ["partial"]),
    progress_t("dunvarrick count progress", "dunvarrick", ["exact"]),
    none_t("whats the turnout in caddenmill", tags=["contraction"]),
    none_t("who won marrowby back in 2022", focus="who", never=[name(winner("marrowby"))]),
    none_t("who's going to be leader of the council now", focus="who", tags=["contraction"]),
    cmargin_t("how much did orla win by", "c01", tags=["partial"]),
    cmargin_t("By how many votes did Caelan Dunstreth lose?", "c37", tags=["exact"]),
    compare_t("is nevin corrigane ahead of ulric fennow", "c12", "c13", tags=["exact"]),
    totals_t("top two parties by seats", 2, ["number_words", "constraint"]),
    raw_t("asdfgh jkl", "none", None, "not_understood", "other", tags=["gibberish"]),
    place_t("who came fifth in ashvenny north", "ashvenny-north", 5, ["number_words", "uncovered"]),
    nodata_t("who won harrowgate ward", "ward_winner", {}, "who"),
    cresult_t("how many votes did pim wystrel get", "c20", focus="mark", votes=True, tags=["exact"]),
    winner_t("Who topped the poll in Dunvarrick ward?", "dunvarrick", ["exact"]),
    results_t("give me the numbers for ashvenny north", "ashvenny-north", ["exact"]),
    cresult_t("what did varian kestrove get", "c04", focus="mark", votes=True, tags=["exact"]),
    cparty_t("which party is juna tullock", "c19", ["exact"]),
    cparty_t("Bastien Elsmyre party?", "c38", ["exact", "terse"]),
    cparty_t("perrin farrowgate - which ward and which party", "c39", ["exact"]),
    pward_t("did the progressives win in ashvenny north", "moorland", "ashvenny-north",
            ["partial"], focus="whether"),
    compare_t("did tove inglemarsh finish above joram hestermoor", "c42", "c41", tags=["exact"]),
    cmargin_t("who beat ulric fennow and by how many", "c13", tags=["exact"], focus="who"),
    cmargin_t("delphy vardisse margin of defeat", "c02", tags=["exact", "terse"]),
    place_t("whos in 4th in quellan cross", "quellan-cross", 4, ["contraction", "constraint"]),
    place_t("who got the fewest votes in caddenmill", "caddenmill", len(ranked("caddenmill")),
            ["constraint"]),
    none_t("which ward had the highest turnout"),
    none_t("how many spoiled ballots were there in marrowby", focus="count"),
    none_t("who leads the civic greens", focus="who", never=[name(winner("fennick-green"))]),
    none_t("what is the lantern party's policy on housing"),
    none_t("when was brindle quay declared", focus="when",
           never=[CONTESTS["brindle-quay"]["updated"][11:16]]),
    none_t("what time did the lanmouth count start", focus="when",
           never=[CONTESTS["lanmouth"]["start"][11:16]]),
    none_t("where is the ashvenny north count taking place", focus="where",
           never=[CONTESTS["ashvenny-north"]["venue"]]),
    none_t("which candidate got the most votes in the whole county", focus="who",
           never=[name(max((e for c in CONTESTS.values() for e in c["entries"]), key=votes_of)["competitor"])]),
    none_t("did anyone lose their deposit", focus="whether"),
    none_t("is there going to be a coalition", focus="other"),
    none_t("what share of the vote did moorland get county wide", focus="mark", tags=["voice"]),
    none_t("how many people are registered to vote in gorsevane", focus="count"),
    raw_t("tell me a joke", "none", None, "not_understood", "other", tags=["off_topic"]),
    raw_t("play radio tamsendale", "none", None, "not_understood", "other", tags=["off_topic", "voice"]),
    pward_t("how did the greens get on in ashvenny north", "greens", "ashvenny-north", ["exact"]),
    pward_t("harbour result in pellin heath", "harbour", "pellin-heath", ["partial", "terse"]),
    results_t("give me the top 3 in caddenmill", "caddenmill", ["constraint"], top=3),
    compare_t("Quenlow vs Vardisse, who came out on top?", "c01", "c02", tags=["partial"]),
    leader_t("who is winning ashvenny south", "ashvenny-south", ["exact"]),
    leader_t("whose ahead in the heath", "pellin-heath", ["partial", "misspelling"]),
    results_t("wrenlow sands full breakdown", "wrenlow-sands", ["exact"]),
    progress_t("votes counted so far in marrowby?", "marrowby", ["exact"]),
    open_t("has every ward declared now", ["exact"], focus="status"),
    cparty_t("tamsin brannick party", "c07", ["exact", "terse"]),
    cresult_t("how did quilla do", "c35", tags=["partial"], focus="how_did"),
    cresult_t("how did rhosyn dretholm get on", "c08", tags=["exact"], focus="how_did"),
    cresult_t("is sten lusketh a councillor now", "c16", tags=["exact"]),
    pward_t("how did the green party do in wrenlow", "greens", "wrenlow-sands", ["partial"]),
    nodata_t("how many seats has the labour party won", "party_seats", {}, "count"),
    nodata_t("who won the mayoral race", "ward_winner", {}, "who"),
    place_t("who came in at number two in brindle quay", "brindle-quay", 2, ["number_words"]),
    place_t("who finished in third place in gorsevane", "gorsevane", 3, ["number_words"]),
    winner_t("who wun caddenmil", "caddenmill", ["misspelling"]),
    cparty_t("wat party is gaspard torvaine", "c06", ["misspelling"]),
    pseats_t("hw many seats lanterns", "lantern", ["misspelling", "terse"]),
    results_t("quelan cross result", "quellan-cross", ["misspelling"]),
    place_t("who came third in dunvarick", "dunvarrick", 3, ["misspelling", "number_words"]),
    cresult_t("how did odile yelmer do", "c03", tags=["misspelling"], focus="how_did"),
    cresult_t("Hi, sorry to bother you, but I was wondering whether Varian Kestrove managed to win "
              "in the end?", "c04", tags=["chatty", "polite"]),
    compare_t("is lowen abernell ahead of quilla brannick", "c34", "c35", tags=["exact"]),
    winner_t("who won yesterday in lanmouth", "lanmouth", ["relative_day"]),
    results_t("last nights result in marrowby", "marrowby", ["relative_day", "contraction"]),
    pseats_t("how many seats did the alliance pick up last night", "harbour", ["relative_day", "partial"]),
    pseats_t("how many wards did tollgate take", "tollgate", ["partial"]),
    pward_t("did the lanterns win pellin heath", "lantern", "pellin-heath", ["not_standing"],
            focus="whether"),
    results_t("list all the candidates in marrowby", "marrowby", ["exact"]),
    none_t("whats the swing from harbour to moorland in caddenmill", focus="margin"),
    none_t("how many postal votes came in", focus="count"),
    none_t("who's the youngest new councillor", focus="who", tags=["contraction"]),
    none_t("is orla quenlow the sitting councillor", focus="whether"),
    none_t("how many votes were cast altogether in fennick green", focus="count",
           never=[fmt(sum(votes_of(e) for e in CONTESTS["fennick-green"]["entries"]))]),
    none_t("who won by the biggest margin", focus="who",
           never=[name(winner(max(CONTESTS, key=margin)))]),
    chat_t("hey", "greeting"),
    chat_t("what sort of things can i ask you", "help"),
    none_t("how many seats have moorland won in the wards counted at tamsendale civic hall",
           focus="count", tags=["constraint"],
           never=[count_word(dict(seats())["moorland"])]),
    none_t("who was leading in quellan cross at midnight", focus="who", tags=["constraint"],
           never=[name(leader("quellan-cross"))]),
    none_t("what was the count up to in ashvenny south at 1am", focus="status",
           tags=["constraint"], never=[counted_pct("ashvenny-south")]),
    none_t("how many seats did harbour win by fewer than 100 votes", focus="count",
           tags=["constraint"], never=[count_word(dict(seats())["harbour"])]),
    cresult_t("did rose mund vossery win", "c30", tags=["voice", "mishearing"]),
    cparty_t("what party is ulrich fennow", "c13", ["mishearing"]),
    cmargin_t("kesha cara vine margin", "c36", tags=["voice", "mishearing", "terse"]),
    pward_t("how did harbour do in dun varrick", "harbour", "dunvarrick", ["voice", "mishearing"]),
]

CONVERSATIONS = [
    [
        chat_t("hello", "greeting"),
        winner_t("who won ashvenny north?", "ashvenny-north", ["exact"]),
        cmargin_t("by how much?", "c01", "ashvenny-north", ["follow_up", "ellipsis"]),
        chat_t("cheers", "thanks", ["thanks_between"]),
    ],
    [
        clarify_t("ashvenny result", "ward_results", {}, ASH, "results", ["ambiguous", "partial"]),
        results_t("the south one", "ashvenny-south", ["follow_up", "ellipsis"]),
        cresult_t("so pellagan lost?", "c05", "ashvenny-south", ["follow_up", "partial"]),
    ],
    [
        pseats_t("how are the moorland progressives doing seat wise", "moorland", ["exact", "chatty"]),
        pseats_t("and harbour?", "harbour", ["follow_up", "ellipsis", "partial"]),
        winner_t("which of those two won caddenmill", "caddenmill", ["follow_up", "pronoun"]),
        pward_t("what about tollgate in dunvarrick", "tollgate", "dunvarrick", ["new_question", "partial"]),
    ],
    [
        clarify_t("brannick result", "candidate_result", {}, BRANNICK, "whether",
                  ["ambiguous", "partial"]),
        cresult_t("the greens one", "c07", tags=["follow_up", "ellipsis"]),
        cparty_t("what party is the other one", "c35", ["follow_up", "pronoun"]),
    ],
    [
        winner_t("who won pellin heath", "pellin-heath", ["exact", "voice"]),
        cmargin_t("what was her majority", "c33", "pellin-heath", ["follow_up", "pronoun"]),
        progress_t("how much of the heath was actually counted", "pellin-heath", ["follow_up", "partial"]),
    ],
    [
        none_t("closest race tonight?", focus="margin", tags=["relative_day"],
               never=[wname("ashvenny-south"), "25"]),
        winner_t("ok then who won ashvenny south", "ashvenny-south", ["new_question"]),
        cmargin_t("margin?", "c06", "ashvenny-south", ["follow_up", "ellipsis"]),
        chat_t("thank you", "thanks"),
    ],
    [
        pward_t("how did the civic greens do in fennick green", "greens", "fennick-green", ["exact"]),
        pward_t("and the lanterns there", "lantern", "fennick-green", ["follow_up", "ellipsis"]),
        place_t("who was third", "fennick-green", 3, ["follow_up", "ellipsis", "number_words"]),
    ],
    [
        leader_t("who's leading in wrenlow", "wrenlow-sands", ["partial", "contraction"]),
        progress_t("is it all counted", "wrenlow-sands", ["follow_up", "pronoun"]),
        pward_t("how many votes did the moorland candidate get there", "moorland", "wrenlow-sands",
                ["follow_up", "pronoun"], focus="mark"),
    ],
    [
        place_t("who came second in caddenmill", "caddenmill", 2, ["number_words"]),
        cmargin_t("how far behind was he", "c13", "caddenmill", ["follow_up", "pronoun"]),
        cparty_t("which party is he with", "c13", ["follow_up", "pronoun"]),
    ],
    [
        none_t("whats the total harbour alliance vote across the whole county", focus="mark"),
        pseats_t("fine, how many seats did they win then", "harbour", ["follow_up", "pronoun"]),
    ],
    [
        chat_t("help", "help"),
        open_t("which wards are still counting", ["exact"]),
        totals_t("ok seat totals then", tags=["new_question"]),
    ],
    [
        winner_t("who won gorse vane", "gorsevane", ["voice", "mishearing"]),
        place_t("who was the runner up", "gorsevane", 2, ["follow_up", "ellipsis"]),
        none_t("how old is he", focus="other", tags=["follow_up", "pronoun"]),
    ],
    [
        results_t("full results quellan cross", "quellan-cross", ["exact"]),
        none_t("was there a recount", focus="other", tags=["follow_up"]),
        cmargin_t("how close did dunstreth get", "c37", "quellan-cross", ["follow_up", "partial"]),
    ],
    [
        cparty_t("what ward is rosmund vossery standing in", "c30", ["exact"], focus="where"),
        cresult_t("did he win", "c30", tags=["follow_up", "pronoun"]),
        cresult_t("with how many votes", "c30", tags=["follow_up", "ellipsis"], focus="mark", votes=True),
        none_t("where was his count held", focus="where", tags=["follow_up", "pronoun"],
               never=[CONTESTS["marrowby"]["venue"]]),
    ],
    [
        leader_t("whos top in lanmouth", "lanmouth", ["contraction"]),
        nodata_t("and the conservative vote", "party_in_ward", {"contest": "lanmouth"}, "how_did",
                 tags=["follow_up", "ellipsis"]),
        pward_t("what about the greens", "greens", "lanmouth", ["follow_up", "ellipsis"]),
    ],
    [
        progress_t("is the count finished in dunvarrick", "dunvarrick", ["exact"]),
        winner_t("who won it", "dunvarrick", ["follow_up", "pronoun"]),
    ],
    [
        winner_t("who won in brindle quay and for which party", "brindle-quay", ["exact"]),
        cresult_t("how many votes did mirrowen get", "c10", "brindle-quay", tags=["follow_up", "partial"],
                  focus="mark", votes=True),
        chat_t("thx", "thanks", ["abbreviation"]),
    ],
    [
        compare_t("is torvane ahead of pellagan", "c06", "c05", tags=["partial"]),
        cmargin_t("what was the gap", "c06", tags=["follow_up", "ellipsis"], slots=False),
        none_t("was pellagan in front earlier in the night", focus="whether",
               tags=["follow_up", "partial"]),
        place_t("ok who came third there", "ashvenny-south", 3, ["follow_up", "pronoun"]),
    ],
    [
        none_t("how many seats do you need for a majority on the council", focus="count"),
        pseats_t("how many have moorland got", "moorland", ["new_question", "partial"]),
    ],
    [
        winner_t("Good morning! Could you tell me who won Caddenmill please?", "caddenmill",
                 ["chatty", "exact"]),
        cmargin_t("was it close", "c12", "caddenmill", ["follow_up", "pronoun"]),
        winner_t("and who won marrowby", "marrowby", ["follow_up", "new_question"]),
    ],
    [
        pward_t("how did the independents do in gorsevane", "tollgate", "gorsevane", ["partial"]),
        pward_t("and in quellan", "tollgate", "quellan-cross", ["follow_up", "ellipsis", "partial"]),
        pseats_t("how many seats do they have overall", "tollgate", ["follow_up", "pronoun"]),
    ],
    [
        pward_t("who was the lantern candidate in lanmouth", "lantern", "lanmouth", ["partial"],
                focus="who", votes=False),
        cresult_t("did she get in", "c26", "lanmouth", tags=["follow_up", "pronoun"]),
        compare_t("did she beat mirela stellick", "c26", "c27", "lanmouth", tags=["follow_up", "pronoun"]),
    ],
    [
        raw_t("whats the weather like tomorrow", "none", None, "not_understood", "other",
              tags=["off_topic", "relative_day"]),
        winner_t("ok then who won fennick green", "fennick-green", ["new_question"]),
    ],
    [
        none_t("can you give me every ward result in one go", focus="results"),
        results_t("ok just pellin heath then", "pellin-heath", ["follow_up", "partial"]),
        place_t("who came last", "pellin-heath", len(ranked("pellin-heath")), ["follow_up", "ellipsis"]),
    ],
    [
        winner_t("who won marrow bee", "marrowby", ["voice", "mishearing"]),
        place_t("and who was second", "marrowby", 2, ["follow_up", "ellipsis"]),
        cparty_t("what party is she", "c31", ["follow_up", "pronoun"]),
        pseats_t("how many seats has that party won", "harbour", ["follow_up", "pronoun"]),
    ],
    [
        none_t("when does the counting finish", focus="when"),
        open_t("are there any wards left to declare", ["new_question"], focus="open"),
        chat_t("thanks a lot", "thanks"),
    ],
    [
        cresult_t("did yara glenvane get elected", "c40", tags=["exact"]),
        cmargin_t("by how much", "c40", None, ["follow_up", "ellipsis"]),
        raw_t("who did she beat", None, None, "answered", "who", [name(at_place("wrenlow-sands", 2))],
              None, ["follow_up", "pronoun"]),
    ],
    [
        none_t("how many women won seats tonight", focus="count", tags=["relative_day"]),
        pseats_t("how many seats did the lantern party win", "lantern", ["exact", "new_question"]),
    ],
    [
        progress_t("how much has been counted in the quay", "brindle-quay", ["partial"]),
        progress_t("and in fennick", "fennick-green", ["follow_up", "ellipsis", "partial"]),
        winner_t("who won there", "fennick-green", ["follow_up", "pronoun"]),
    ],
    [
        # which intent answers a two-party seat comparison is not fixed: only facts are checked
        raw_t("are harbour ahead of moorland on seats", None, None, "answered", "compare",
              [gname("moorland"), count_word(dict(seats())["moorland"]),
               gname("harbour"), count_word(dict(seats())["harbour"])], None, ["partial"]),
        totals_t("give me the full seat table", tags=["follow_up"]),
        none_t("which party gained the most seats compared with last time", focus="who",
               tags=["new_question"]),
    ],
    [
        clarify_t("who won", "ward_winner", {}, None, "who", ["missing_slot", "terse"]),
        winner_t("dunvarrick", "dunvarrick", ["follow_up", "ellipsis"]),
        place_t("and who came 2nd", "dunvarrick", 2, ["follow_up", "ellipsis"]),
    ],
    [
        clarify_t("how much is counted", "count_progress", {}, None, "status", ["missing_slot"]),
        progress_t("in caddenmill", "caddenmill", ["follow_up", "ellipsis"]),
        chat_t("thanks", "thanks", ["thanks_between"]),
        winner_t("one more - who won lanmouth town", "lanmouth", ["new_question"]),
    ],
    [
        clarify_t("how did they do in gorsevane", "party_in_ward", {"contest": "gorsevane"}, None,
                  "how_did", ["missing_slot", "pronoun"]),
        pward_t("the alliance", "harbour", "gorsevane", ["follow_up", "ellipsis", "partial"]),
        cresult_t("is he elected", "c23", "gorsevane", tags=["follow_up", "pronoun"]),
    ],
    [
        winner_t("who won quellan", "quellan-cross", ["partial"]),
        cparty_t("what party is kesia in", "c36", ["follow_up", "partial"]),
        pseats_t("how many seats has moorland got altogether", "moorland", ["follow_up", "partial"]),
        place_t("back to quellan, who came fourth", "quellan-cross", 4,
                ["follow_up", "return_to_subject", "number_words"]),
    ],
    [
        winner_t("ok so who won ash venny north", "ashvenny-north", ["voice", "mishearing"]),
        winner_t("what about the other ash venny", "ashvenny-south", ["follow_up", "voice", "mishearing"]),
        progress_t("how much was counted there", "ashvenny-south", ["follow_up", "pronoun"]),
    ],
    [
        nodata_t("who got in for tamsendale ward", "ward_winner", {}, "who", tags=["not_in_data"]),
        place_t("sorry i mean caddenmill - who came 3rd", "caddenmill", 3, ["follow_up", "new_question"]),
    ],
    [
        cresult_t("did fenwick savrelle win", "c18", tags=["exact"]),
        compare_t("did savrelle at least beat rennow", "c18", "c17", tags=["follow_up", "partial"]),
        cmargin_t("and how much did the winner win by", "c16", "dunvarrick", ["follow_up"],
                  slots=False),
    ],
    [
        chat_t("hiya", "greeting"),
        totals_t("top party?", 1, ["terse"], focus="who", slots=False, never=False),
        chat_t("great thanks", "thanks"),
    ],
    [
        cresult_t("did nessa mirrowen win brindle quay", "c10", "brindle-quay", ["exact"]),
        winner_t("who did then", "brindle-quay", ["follow_up", "ellipsis"]),
        pward_t("how did moorland do there", "moorland", "brindle-quay", ["follow_up", "pronoun"]),
    ],
    [
        pward_t("how did the tollgate independents do in ashvenny north", "tollgate", "ashvenny-north",
                ["exact", "not_standing"]),
        pward_t("and in ashvenny south", "tollgate", "ashvenny-south", ["follow_up", "ellipsis"]),
    ],
    [
        winner_t("who won the seat in wren low sands", "wrenlow-sands", ["voice", "mishearing"]),
        none_t("was it a recount", focus="other", tags=["follow_up", "pronoun"]),
        cresult_t("how many votes did hestermoor end up with", "c41", "wrenlow-sands",
                  tags=["follow_up", "partial"],
                  focus="mark", votes=True),
    ],
    [
        compare_t("is kesia carravine ahead of caelan dunstreth", "c36", "c37", tags=["exact"]),
        progress_t("has that one finished counting", "quellan-cross", ["follow_up", "pronoun"]),
        results_t("who else stood there", "quellan-cross", ["follow_up", "pronoun"]),
    ],
    [
        winner_t("yo who won in the quay", "brindle-quay", ["partial", "chatty"]),
        winner_t("what about pellin", "pellin-heath", ["follow_up", "ellipsis", "partial"]),
        winner_t("and the sands", "wrenlow-sands", ["follow_up", "ellipsis", "partial"]),
        chat_t("cheers mate", "thanks"),
    ],
    [
        cresult_t("did gaspard torvane win", "c06", tags=["exact"]),
        results_t("who was he up against", "ashvenny-south", ["follow_up", "pronoun"]),
        compare_t("did the tollgate guy beat the greens one there", "c08", "c07",
                  tags=["follow_up", "pronoun"]),
    ],
    [
        pward_t("how did harbour do in marrowby", "harbour", "marrowby", ["partial"]),
        cresult_t("so she didnt get in then?", "c31", "marrowby", tags=["follow_up", "pronoun"]),
        cmargin_t("who beat her and by how much", "c31", "marrowby", tags=["follow_up", "pronoun"],
                  focus="who"),
        none_t("is that the biggest winning margin of the night", focus="whether",
               tags=["follow_up", "pronoun"]),
    ],
]


# ---------------------------------------------------------------- writing
def finish(turn):
    tags = turn.pop("_tags")
    return turn, tags


def build():
    cases = []
    for t in SINGLES:
        t, tags = finish(dict(t))
        if tags:
            t["tags"] = sorted(set(tags))
        cases.append(t)
    for conv in CONVERSATIONS:
        assert 2 <= len(conv) <= 6
        turns, tags = [], set()
        for t in conv:
            t, tg = finish(dict(t))
            tags |= set(tg)
            turns.append(t)
        tags |= {"follow_up"} if len(turns) > 1 else set()
        cases.append({"conversation": turns, "tags": sorted(tags)})
    return cases


def stats(cases):
    turns = []
    for c in cases:
        turns += c["conversation"] if "conversation" in c else [c]
    conv = sum(1 for c in cases if "conversation" in c)
    unc = sum(1 for t in turns if t.get("intent") == "none" and t.get("outcome") == "not_covered")
    tagc = {}
    for c in cases:
        for tg in c.get("tags", []):
            tagc[tg] = tagc.get(tg, 0) + 1
    return len(turns), conv, unc, tagc


def main():
    cases = build()
    n, conv, unc, tagc = stats(cases)
    header = (
        "# Blind question set: scenario election, moment 03:45\n"
        "# (every replay batch applied; clock 2027-05-07T03:45+01:00).\n"
        "# Written by tests/eval/blind/round3/label_election_0345.py from dataset-demo/election/.\n"
        f"# {n} turns, {conv} conversations, {unc} turns not covered ({100 * unc / n:.1f}%).\n"
    )
    body = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=100)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)
    print(f"turns={n} conversations={conv} uncovered={unc} ({100 * unc / n:.1f}%)")
    print("tags:", dict(sorted(tagc.items(), key=lambda kv: -kv[1])))
    print("seats:", seats(), "open:", open_wards())


if __name__ == "__main__":
    main()
