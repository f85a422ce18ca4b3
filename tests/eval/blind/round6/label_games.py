#!/usr/bin/env python3
"""Blind question set for the games scenario (round 6).

Moment: Saturday 14 August 2027, 21:10 Europe/Lisbon (+01:00); data as of 21:04.
"today" = 2027-08-14, "tomorrow" = 2027-08-15, "yesterday" = 2027-08-13.

Every expected fact (`says` / `never`) is computed here from the JSON files in
dataset-demo/games/.  Questions are written as data: ask, intent, slots,
outcome, focus, plus a small "fact recipe" evaluated against the data.

Run:  python3 label_games.py      (writes games.yaml next to this script)
"""
import json
import os
import sys
from collections import defaultdict

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "games"))
OUT = os.path.join(HERE, "games.yaml")

MOMENT = "2027-08-14T21:10+01:00"
TODAY, TOMORROW, YESTERDAY = "2027-08-14", "2027-08-15", "2027-08-13"
CLOCK_LOCAL = "2027-08-14T21:10"


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as fh:
        return json.load(fh)


CONTESTS = load("contests.json")
COMPETITORS = load("competitors.json")
GROUPS = load("groups.json")
SPORTS = load("sports.json")
SCEN = load("scenario.json")
assert SCEN["as_of"].startswith("2027-08-14T21:04"), SCEN["as_of"]

CON = {c["id"]: c for c in CONTESTS}
PER = {p["id"]: p for p in COMPETITORS}
GRP = {g["id"]: g for g in GROUPS}
SPO = {s["id"]: s for s in SPORTS}
DISC = {(s["id"], d["id"]): d for s in SPORTS for d in s["disciplines"]}
AWARDS = ["gold", "silver", "bronze"]

WORDS = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


# ---------------------------------------------------------------- helpers
def pid(family, given=None):
    """Competitor id from a family name (and given name when needed)."""
    hits = [p["id"] for p in COMPETITORS
            if p["family"] == family and (given is None or p["given"] == given)]
    assert len(hits) == 1, (family, given, hits)
    return hits[0]


def pname(p):
    q = PER[p]
    return f'{q["given"]} {q["family"]}'


def gname(g):
    return GRP[g]["name"]


def group_of(p):
    return PER[p]["group"]


def count_word(n):
    return WORDS[n] if 0 < n < 10 else str(n)


def ordinal(n):
    n = int(n)
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def to_seconds(mark):
    parts = mark.split(":")
    total = 0.0
    for part in parts:
        total = total * 60 + float(part)
    return total


def decimals(mark):
    last = mark.split(":")[-1]
    return len(last.split(".")[1]) if "." in last else 0


def fmt_time_seconds(sec, dec):
    if sec < 60:
        return f"{sec:.{dec}f} s"
    if sec < 3600:
        m = int(sec // 60)
        s = sec - 60 * m
        width = 3 + dec if dec else 2
        return f"{m}:{s:0{width}.{dec}f}"
    h = int(sec // 3600)
    rest = sec - 3600 * h
    m = int(rest // 60)
    s = rest - 60 * m
    width = 3 + dec if dec else 2
    return f"{h}:{m:02d}:{s:0{width}.{dec}f}"


def fmt_mark(cid, mark):
    c = CON[cid]
    if c["measure"] == "time":
        return fmt_time_seconds(to_seconds(mark), decimals(mark))
    if c["measure"] == "distance":
        return f"{float(mark):.2f} m"
    return mark  # points as the data writes them


def fmt_gap(cid, a, b):
    c = CON[cid]
    if c["measure"] == "time":
        dec = max(decimals(a), decimals(b))
        gap = abs(to_seconds(a) - to_seconds(b))
        assert gap < 60, (cid, a, b)
        return f"{gap:.{dec}f} s"
    dec = max(len(a.split(".")[1]), len(b.split(".")[1]))
    gap = abs(float(a) - float(b))
    return f"{gap:.{dec}f} m" if c["measure"] == "distance" else f"{gap:.{dec}f}"


def entrant(e):
    return gname(e["group"]) if "group" in e else pname(e["competitor"])


def members(e):
    return e.get("members", [e.get("competitor")])


def entry_of(p, cid):
    for e in CON[cid]["entries"]:
        if p in members(e):
            return e
    raise KeyError((p, cid))


def entry_of_group(g, cid):
    out = []
    for e in CON[cid]["entries"]:
        eg = e["group"] if "group" in e else group_of(e["competitor"])
        if eg == g:
            out.append(e)
    return out


def at_place(cid, place):
    return [entrant(e) for e in CON[cid]["entries"] if e.get("place") == place]


def last_place(cid):
    return max(e["place"] for e in CON[cid]["entries"] if e.get("place"))


def with_award(cid, award):
    return [entrant(e) for e in CON[cid]["entries"] if e.get("award") == award]


def podium_names(cid):
    out = []
    for a in AWARDS:
        out += with_award(cid, a)
    return out


def ranked(cid, n=None):
    es = sorted([e for e in CON[cid]["entries"] if e.get("place")], key=lambda e: e["place"])
    return es if n is None else es[:n]


def winner_margin(cid):
    es = ranked(cid)
    return fmt_gap(cid, es[0]["mark"], es[1]["mark"])


def result_facts(p, cid):
    e = entry_of(p, cid)
    assert e.get("place"), (p, cid)
    return [ordinal(e["place"]), fmt_mark(cid, e["mark"])]


def ahead(p, r, cid):
    a, b = entry_of(p, cid), entry_of(r, cid)
    assert a["place"] != b["place"], (p, r, cid)
    return pname(p) if a["place"] < b["place"] else pname(r)


def contests_of(p):
    return [c["id"] for c in CONTESTS if any(p in members(e) for e in c["entries"])]


def disciplines_of(p):
    out = []
    for cid in contests_of(p):
        c = CON[cid]
        name = DISC[(c["sport"], c["discipline"])]["name"]
        if name not in out:
            out.append(name)
    return out


def disc_name(cid):
    c = CON[cid]
    return DISC[(c["sport"], c["discipline"])]["name"]


def next_contest(p):
    upcoming = [CON[c] for c in contests_of(p)
                if CON[c]["status"] == "scheduled" and CON[c]["start"] > CLOCK_LOCAL]
    upcoming.sort(key=lambda c: c["start"])
    return upcoming[0]["id"] if upcoming else None


def hhmm(cid):
    return CON[cid]["start"][11:16]


def medals_of(p, award=None):
    n = 0
    for c in CONTESTS:
        if c["status"] != "final":
            continue
        for e in c["entries"]:
            if "award" in e and p in members(e) and (award is None or e["award"] == award):
                n += 1
    return n


def awards_of(p):
    out = []
    for c in CONTESTS:
        for e in c["entries"]:
            if "award" in e and p in members(e):
                out.append(e["award"])
    return out


def tally(sport=None, date=None):
    t = defaultdict(lambda: {"gold": 0, "silver": 0, "bronze": 0})
    for c in CONTESTS:
        if c["status"] != "final":
            continue
        if sport and c["sport"] != sport:
            continue
        if date and c["start"][:10] != date:
            continue
        for e in c["entries"]:
            if "award" in e:
                g = e["group"] if "group" in e else group_of(e["competitor"])
                t[g][e["award"]] += 1
    return t


def table(sport=None, date=None, award=None):
    t = tally(sport, date)
    if award:
        key = lambda g: (t[g][award],)
        rows = [g for g in t if t[g][award] > 0]
    else:
        key = lambda g: (t[g]["gold"], t[g]["silver"], t[g]["bronze"])
        rows = list(t)
    rows.sort(key=lambda g: tuple(-x for x in key(g)))
    ranks = {}
    for i, g in enumerate(rows):
        ranks[g] = ranks[rows[i - 1]] if i and key(g) == key(rows[i - 1]) else i + 1
    return rows, ranks, t


def leaders(sport=None, date=None, award=None):
    rows, ranks, _ = table(sport, date, award)
    return [g for g in rows if ranks[g] == 1]


def top(n, sport=None, date=None, award=None):
    rows, ranks, _ = table(sport, date, award)
    return [g for g in rows if ranks[g] <= n]


def most(sport=None, date=None, award=None):
    t = tally(sport, date)
    val = (lambda g: t[g][award]) if award else (lambda g: sum(t[g].values()))
    best = max(val(g) for g in t)
    return [g for g in t if val(g) == best], best


def group_count(g, sport=None, date=None, award=None):
    t = tally(sport, date)
    if g not in t:
        return 0
    return t[g][award] if award else sum(t[g].values())


def group_rank(g):
    _, ranks, _ = table()
    return ordinal(ranks[g])


def schedule(date, sport=None):
    return [c["id"] for c in sorted(CONTESTS, key=lambda c: c["start"])
            if c["start"][:10] == date and (sport is None or c["sport"] == sport)]


def live(sport=None):
    return [c["id"] for c in CONTESTS
            if c["status"] == "live" and (sport is None or c["sport"] == sport)]


def best_mark(sport, disc, category, rnd=None):
    cs = [c for c in CONTESTS if c["sport"] == sport and c["discipline"] == disc
          and c["category"] == category and c["status"] in ("final", "live")
          and (rnd is None or c["phase"].startswith(rnd))]
    marks = [(c["id"], e["mark"]) for c in cs for e in c["entries"] if e.get("place")]
    measure = cs[0]["measure"]
    if measure == "time":
        cid, m = min(marks, key=lambda x: to_seconds(x[1]))
    else:
        cid, m = max(marks, key=lambda x: float(x[1]))
    return fmt_mark(cid, m)


def cid_of(sport, disc, category, phase="final"):
    hits = [c["id"] for c in CONTESTS if c["sport"] == sport and c["discipline"] == disc
            and c["category"] == category and c["phase"] == phase]
    assert len(hits) == 1, (sport, disc, category, phase, hits)
    return hits[0]


# ---------------------------------------------------------------- turns
def T(ask, intent, slots=None, focus="who", outcome="answered", says=None, never=None, tags=()):
    t = {"ask": ask, "intent": intent}
    if intent != "none":
        t["slots"] = dict(slots or {})
    t["outcome"] = outcome
    t["focus"] = focus
    if says:
        t["says"] = [str(s) for s in says]
    if never:
        t["never"] = [str(s) for s in never]
    if tags:
        t["tags"] = list(tags)
    return t


def U(ask, focus="other", never=None, tags=()):
    """A question no intent answers (or about data the files do not hold)."""
    return T(ask, "none", focus=focus, outcome="not_covered", never=never,
             tags=["uncovered"] + list(tags))


def NU(ask, tags=()):
    return T(ask, "none", focus="other", outcome="not_understood", tags=list(tags))


def CONV(tags, *turns):
    return {"conversation": list(turns), "tags": list(tags)}


# ids used below ------------------------------------------------------------
M100 = cid_of("athletics", "100m", "men")
W100 = cid_of("athletics", "100m", "women")
W100H1 = cid_of("athletics", "100m", "women", "heat 1")
W100H2 = cid_of("athletics", "100m", "women", "heat 2")
M100H1 = cid_of("athletics", "100m", "men", "heat 1")
M200 = cid_of("athletics", "200m", "men")
W200 = cid_of("athletics", "200m", "women")
M400 = cid_of("athletics", "400m", "men")
W400 = cid_of("athletics", "400m", "women")
M1500 = cid_of("athletics", "1500m", "men")
W1500 = cid_of("athletics", "1500m", "women")
MLJ = cid_of("athletics", "long-jump", "men")
WLJ = cid_of("athletics", "long-jump", "women")
WMAR = cid_of("athletics", "marathon", "women")
MMAR = cid_of("athletics", "marathon", "men")
MHJ = cid_of("athletics", "high-jump", "men")
WHJ = cid_of("athletics", "high-jump", "women")
MJAV = cid_of("athletics", "javelin", "men")
WJAV = cid_of("athletics", "javelin", "women")
W100FR = cid_of("swimming", "100m-freestyle", "women")
M100FR = cid_of("swimming", "100m-freestyle", "men")
W200FR = cid_of("swimming", "200m-freestyle", "women")
M200FR = cid_of("swimming", "200m-freestyle", "men")
W200FLY = cid_of("swimming", "200m-butterfly", "women")
M200FLY = cid_of("swimming", "200m-butterfly", "men")
W100BR = cid_of("swimming", "100m-breaststroke", "women")
M100BR = cid_of("swimming", "100m-breaststroke", "men")
W400IM = cid_of("swimming", "400m-individual-medley", "women")
M400IM = cid_of("swimming", "400m-individual-medley", "men")
W1X = cid_of("rowing", "single-sculls", "women")
M1X = cid_of("rowing", "single-sculls", "men")
M2X = cid_of("rowing", "double-sculls", "men")
W2X = cid_of("rowing", "double-sculls", "women")
MRR = cid_of("cycling", "road-race", "men")
WRR = cid_of("cycling", "road-race", "women")
WTT = cid_of("cycling", "time-trial", "women")
MTT = cid_of("cycling", "time-trial", "men")
MAA = cid_of("gymnastics", "all-around", "men")
WAA = cid_of("gymnastics", "all-around", "women")
WFL = cid_of("gymnastics", "floor", "women")
MFL = cid_of("gymnastics", "floor", "men")
WVT = cid_of("gymnastics", "vault", "women")
MVT = cid_of("gymnastics", "vault", "men")
MBK = cid_of("basketball", "tournament", "men")
WBK = cid_of("basketball", "tournament", "women")

GALKACE = pid("Galkace")
DOSAVORN = pid("Dosavorn")
DORRAGO = pid("Dorrago")
ZORVREN = pid("Zorvren")
QUILLON = pid("Quillon")
MARRANT = pid("Marrant")
TASSEVAR = pid("Tassevar")
BORAN = pid("Kovendal", "Boran")
STEMELLE = pid("Kovendal", "Stemelle")
PELKAMESSI = pid("Pelkamessi")
MORRESSI = pid("Morressi")
TOBI = pid("Dünmark")
DOVONASKO = pid("Dovonasko")
FEMWICK = pid("Femwick")
ZAVINDAL = pid("Zavindal")
CORDVELLE = pid("Cordvelle")
HALMVIK = pid("Halmvik")
BRUSSAND = pid("Brussand")
COSEVMONT = pid("Cosevmont")
HANTANDAL = pid("Hantandal")
BRELWICK = pid("Brelwick")
DASONERT = pid("Dasonert")
OSTRAVIN = pid("Ostravin")
HERVOVETH = pid("Hervoveth")
OCARROWIN = pid("O'Carrowin")
KERRETH = pid("Kerreth")
COSSASKO = pid("Cossasko")
KORVACE = pid("Korvace")
WENDEROW = pid("Wenderow")
GURRORN = pid("Gurrorn")
KRURVASKO = pid("Krurvasko")
HERVACE = pid("Hervace")
TRILUNICK = pid("Trilunick")
BRORRORN = pid("Brorrorn")
ZILKEDORN = pid("Zilkedorn")
NUVASKO = pid("Nuvasko")
GUNTASAND = pid("Guntasand")
FUSTISESSI = pid("Fustisessi")
ZEVERT = pid("Zevert")
TARVAGO = pid("Tarvago")
CEDELL = pid("Cedell")
ZULREN = pid("Zulren")
SALTREVA = pid("Saltreva")
VAMWICK = pid("Vamwick")
TOSTANAYNE = pid("Tostanayne")
LASSOSS = pid("Lassoss")
DULVAIRE = pid("Dulvaire")
QUELLBY = pid("Quellby")
TOLLEVANT = pid("Tollevant")
CONDMONT = pid("Condmont")
SARROMELL = pid("Sarromell")
RENTENERT = pid("Rentenert")
HARRELL = pid("Harrell")
HORELL = pid("Horell")
FUSWICK = pid("Fuswick")
KROMWICK = pid("Kromwick")
CUSOLICK = pid("Cusolick")
GUMARACE = pid("Gumarace")
SONDILLE = pid("Sondille")
KROSAGO = pid("Krosago")
HINELL = pid("Hinell")
MIRVESSI = pid("Mirvessi")
KERALAND = pid("Keraland")


def G(g):
    return gname(g)


def names(ids):
    return [pname(p) for p in ids]


def gnames(gs):
    return [gname(g) for g in gs]


def ent_in_group(g, cid):
    es = entry_of_group(g, cid)
    assert len(es) == 1, (g, cid, es)
    return es[0]


CASES = []
add = CASES.append

# ----------------------------------------------------------- conversations
add(CONV(["sprint", "follow_up"],
    T("hey", "greeting", focus="chat", tags=["chatty"]),
    T("who won the mens 100m last night", "podium", {"contest": M100},
      says=[at_place(M100, 1)[0]], tags=["relative_day", "contraction"]),
    T("what was his time", "competitor_result", {"competitor": GALKACE, "contest": M100},
      focus="mark", says=[fmt_mark(M100, entry_of(GALKACE, M100)["mark"])],
      tags=["follow_up", "pronoun"]),
    T("and how far back was second", "competitor_margin", {"competitor": GALKACE, "contest": M100},
      focus="margin", says=[winner_margin(M100), at_place(M100, 2)[0]],
      tags=["follow_up", "ellipsis"]),
    T("has he won anything else here", "competitor_medals", {"competitor": GALKACE},
      focus="count", says=[count_word(medals_of(GALKACE))], tags=["follow_up", "pronoun"]),
    T("thanks thats all", "thanks", focus="chat", tags=["contraction"]),
))

add(CONV(["voice", "alias", "follow_up"],
    T("who is the key rocket", "competitor_profile", {"competitor": GALKACE},
      focus="profile", says=[pname(GALKACE)], tags=["voice", "mishearing", "alias"]),
    T("which country does he run for", "competitor_delegation", {"competitor": GALKACE},
      focus="group_of", says=[G(group_of(GALKACE))], tags=["voice", "follow_up", "pronoun"]),
    T("how many golds has quessary got altogether", "delegation_medals",
      {"group": "quessary", "award": "gold"}, focus="count",
      says=[count_word(group_count("quessary", award="gold"))], tags=["voice"]),
    T("where are they in the table", "delegation_medals", {"group": "quessary"},
      focus="rank", says=[group_rank("quessary")], tags=["voice", "pronoun", "follow_up"]),
    T("whos above them", "medal_table_leader", {}, focus="who",
      says=gnames(leaders()), tags=["voice", "follow_up"]),
))

add(CONV(["ambiguous", "clarify"],
    T("how did zoe do", "competitor_profile", {}, focus="profile", outcome="clarify",
      says=names([QUILLON, MARRANT, TASSEVAR]), tags=["ambiguous", "partial", "diacritics"]),
    T("the swimmer", "competitor_profile", {"competitor": QUILLON}, focus="profile",
      says=disciplines_of(QUILLON)[:3], tags=["clarify", "follow_up"]),
    T("so how many medals is that", "competitor_medals", {"competitor": QUILLON},
      focus="count", says=[count_word(medals_of(QUILLON))], tags=["follow_up"]),
    T("is she racing again", "competitor_next", {"competitor": QUILLON}, focus="when",
      says=[hhmm(next_contest(QUILLON)), disc_name(next_contest(QUILLON))],
      tags=["follow_up", "pronoun"]),
    T("what about the rower zoe, anything left for her", "competitor_next", {"competitor": MARRANT},
      focus="when", outcome="no_data", never=[hhmm(W2X)],
      tags=["follow_up", "partial", "diacritics"]),
))
assert next_contest(MARRANT) is None

add(CONV(["medal_table"],
    T("who's top of the medal table at the moment?", "medal_table_leader", {}, focus="who",
      says=gnames(leaders()), tags=["contraction"]),
    T("how many golds have they got", "delegation_medals",
      {"group": leaders()[0], "award": "gold"}, focus="count",
      says=[count_word(group_count(leaders()[0], award="gold"))], tags=["follow_up", "pronoun"]),
    T("give me the top five", "medal_table_top", {"count": "5"}, focus="table",
      says=gnames(top(5)), tags=["follow_up", "number_words"]),
    T("who has the most medals overall tho, not just golds", "most_medals", {}, focus="who",
      says=gnames(most()[0]) + [str(most()[1])], tags=["chatty", "tie"]),
    T("and in the pool?", "most_medals", {"sport": "swimming"}, focus="who",
      says=gnames(most("swimming")[0]), tags=["follow_up", "ellipsis", "constraint"]),
    T("what about track and field", "most_medals", {"sport": "athletics"}, focus="who",
      says=gnames(most("athletics")[0]), tags=["follow_up", "ellipsis", "constraint"]),
))

add(CONV(["ambiguous", "clarify", "voice"],
    T("how did kovendal get on", "competitor_profile", {}, focus="profile", outcome="clarify",
      says=names([BORAN, STEMELLE]), tags=["ambiguous", "partial", "voice"]),
    T("the rower", "competitor_profile", {"competitor": BORAN}, focus="profile",
      says=disciplines_of(BORAN), tags=["clarify", "follow_up"]),
    T("what country is that", "competitor_delegation", {"competitor": BORAN}, focus="group_of",
      says=[G(group_of(BORAN))], tags=["follow_up", "pronoun"]),
    T("and the other kovendal whats her country", "competitor_delegation", {"competitor": STEMELLE},
      focus="group_of", says=[G(group_of(STEMELLE))], never=[G(group_of(BORAN))],
      tags=["follow_up", "partial", "voice"]),
    T("did she win a medal", "competitor_medals", {"competitor": STEMELLE}, focus="whether",
      says=awards_of(STEMELLE), tags=["follow_up", "pronoun"]),
))

add(CONV(["schedule", "live"],
    T("whats on today", "schedule_day", {"date": TODAY}, focus="schedule",
      says=[disc_name(c) for c in live()], never=[hhmm(W100)],
      tags=["relative_day", "contraction"]),
    T("anything in the pool tomorrow", "schedule_day", {"date": TOMORROW, "sport": "swimming"},
      focus="schedule", says=[hhmm(c) for c in schedule(TOMORROW, "swimming")],
      never=[hhmm(W100)], tags=["relative_day", "constraint", "follow_up"]),
    T("what time does it start and where", "contest_time", {"contest": W400IM}, focus="when",
      says=[hhmm(W400IM), CON[W400IM]["venue"]], tags=["follow_up", "pronoun"]),
    T("ok and whats going on right now", "under_way", {}, focus="schedule",
      says=[disc_name(c) for c in live()], tags=["new_question"]),
    T("who's leading the javelin", "live_leader", {"contest": MJAV}, focus="who",
      says=[at_place(MJAV, 1)[0], fmt_mark(MJAV, ranked(MJAV)[0]["mark"])],
      tags=["follow_up", "contraction"]),
    T("cheers", "thanks", focus="chat"),
))
assert schedule(TOMORROW, "swimming") == [W400IM]

add(CONV(["sprint", "heats"],
    T("when is the womens 100 final", "contest_time", {"contest": W100}, focus="when",
      says=[hhmm(W100), CON[W100]["venue"]], tags=["contraction"]),
    T("who was quickest in the heats", "best_mark",
      {"discipline": "athletics/100m", "category": "women", "round": "heat"}, focus="mark",
      says=[best_mark("athletics", "100m", "women", "heat")],
      tags=["follow_up", "constraint"]),
    T("who won heat 2", "contest_place", {"contest": W100H2, "place": "1"}, focus="who",
      says=at_place(W100H2, 1), tags=["follow_up", "constraint"]),
    T("where did the brellmoor girl finish in that heat", "delegation_in_event",
      {"group": "brellmoor", "contest": W100H2}, focus="how_did",
      says=[pname(ent_in_group("brellmoor", W100H2)["competitor"]),
            ordinal(ent_in_group("brellmoor", W100H2)["place"])],
      tags=["follow_up", "chatty"]),
    T("is she in the final then", "competitor_next", {"competitor": PELKAMESSI}, focus="whether",
      outcome="no_data", never=[hhmm(W100)], tags=["follow_up", "pronoun"]),
    T("ok and who won the womens 200 earlier in the week", "podium", {"contest": W200},
      says=[at_place(W200, 1)[0]], tags=["new_question"]),
))
assert PELKAMESSI not in [e["competitor"] for e in CON[W100]["entries"]]
assert next_contest(PELKAMESSI) is None

add(CONV(["marathon", "uncovered"],
    U("is it going to rain for the marathon", tags=["chatty"]),
    T("ok who's winning it then", "live_leader", {"contest": MMAR}, focus="who",
      says=at_place(MMAR, 1), tags=["follow_up", "pronoun", "contraction"]),
    U("how old is he", tags=["follow_up", "pronoun"]),
    U("whats his personal best over the distance", tags=["follow_up", "pronoun"]),
    T("where are they running it", "contest_time", {"contest": MMAR}, focus="where",
      says=[CON[MMAR]["venue"]], tags=["follow_up", "pronoun"]),
))

add(CONV(["basketball", "team"],
    T("who won the hoops final", "podium", {"contest": MBK}, says=with_award(MBK, "gold"),
      tags=["alias", "chatty"]),
    T("whats the final score", "full_results", {"contest": MBK}, focus="results",
      says=[ranked(MBK)[0]["mark"], ranked(MBK)[1]["mark"]], tags=["follow_up", "contraction"]),
    T("did big toby get a medal", "competitor_medals", {"competitor": TOBI}, focus="whether",
      says=awards_of(TOBI), tags=["alias", "misspelling"]),
    T("who does he play for", "competitor_delegation", {"competitor": TOBI}, focus="group_of",
      says=[G(group_of(TOBI))], tags=["follow_up", "pronoun"]),
    T("and when is the womens final", "contest_time", {"contest": WBK}, focus="when",
      says=[hhmm(WBK), CON[WBK]["venue"]], tags=["follow_up", "ellipsis"]),
    T("how did orrindel do in the mens", "delegation_in_event", {"group": "orrindel", "contest": MBK},
      focus="how_did", says=[ent_in_group("orrindel", MBK)["award"]],
      tags=["follow_up", "ellipsis", "alias"]),
))

add(CONV(["gymnastics", "live"],
    T("hows the womens all around going", "live_leader", {"contest": WAA}, focus="who",
      says=[at_place(WAA, 1)[0], ranked(WAA)[0]["mark"]], tags=["contraction"]),
    T("show me the top 3", "full_results", {"contest": WAA, "count": "3"}, focus="results",
      says=[entrant(e) for e in ranked(WAA, 3)], never=[entrant(ranked(WAA)[3])],
      tags=["follow_up"]),
    T("has the leader won anything already at these games", "competitor_medals",
      {"competitor": DOVONASKO}, focus="whether", says=awards_of(DOVONASKO),
      tags=["follow_up"]),
    T("who won that floor final", "podium", {"contest": WFL}, says=[at_place(WFL, 1)[0]],
      tags=["follow_up", "pronoun"]),
    T("by how much", "competitor_margin", {"competitor": FEMWICK, "contest": WFL}, focus="margin",
      says=[winner_margin(WFL), at_place(WFL, 2)[0]], tags=["follow_up", "ellipsis"]),
    T("and the men's floor?", "podium", {"contest": MFL}, says=[at_place(MFL, 1)[0]],
      tags=["follow_up", "ellipsis"]),
))
assert awards_of(DOVONASKO) == ["bronze"]

add(CONV(["rowing"],
    T("results of the men's single sculls please", "full_results", {"contest": M1X},
      focus="results", says=[entrant(e) for e in ranked(M1X, 3)] + [fmt_mark(M1X, ranked(M1X)[0]["mark"])]),
    T("how close was it at the top", "competitor_margin", {"competitor": ZAVINDAL, "contest": M1X},
      focus="margin", says=[winner_margin(M1X), at_place(M1X, 2)[0]], tags=["follow_up"]),
    T("who won the double sculls", "podium", {"contest": M2X}, says=with_award(M2X, "gold"),
      tags=["follow_up", "ellipsis"]),
    T("and when's the women's one", "contest_time", {"contest": W2X}, focus="when",
      says=[hhmm(W2X), CON[W2X]["venue"]], tags=["follow_up", "contraction"]),
    T("thanks. unrelated but how many medals has brellmoor got in rowing", "delegation_medals",
      {"group": "brellmoor", "sport": "rowing"}, focus="count",
      says=[count_word(group_count("brellmoor", sport="rowing"))],
      never=[str(group_count("brellmoor"))], tags=["thanks_between", "new_question", "constraint"]),
))

add(CONV(["misspelling"],
    T("wat did hullek dorago get in the 200", "competitor_result", {"competitor": DORRAGO, "contest": M200},
      focus="how_did", says=result_facts(DORRAGO, M200), tags=["misspelling"]),
    T("and in the 100", "competitor_result", {"competitor": DORRAGO, "contest": M100},
      focus="how_did", says=result_facts(DORRAGO, M100), tags=["follow_up", "ellipsis"]),
    T("did he beat dosavorn in the heat", "head_to_head",
      {"competitor": DORRAGO, "rival": DOSAVORN, "contest": M100H1}, focus="whether",
      says=[ahead(DORRAGO, DOSAVORN, M100H1)], tags=["follow_up", "constraint", "partial"]),
    T("what delegation is dosavorn", "competitor_delegation", {"competitor": DOSAVORN},
      focus="group_of", says=[G(group_of(DOSAVORN))], tags=["partial"]),
    T("medals for him?", "competitor_medals", {"competitor": DOSAVORN}, focus="count",
      says=awards_of(DOSAVORN), tags=["follow_up", "pronoun"]),
))

add(CONV(["by_date", "relative_day"],
    T("how many medals did kalvenmark pick up yesterday", "delegation_medals",
      {"group": "kalvenmark", "date": YESTERDAY}, focus="count",
      says=[count_word(group_count("kalvenmark", date=YESTERDAY))],
      never=[count_word(group_count("kalvenmark"))], tags=["relative_day", "constraint"]),
    T("and today", "delegation_medals", {"group": "kalvenmark", "date": TODAY}, focus="count",
      never=[count_word(group_count("kalvenmark"))], tags=["follow_up", "ellipsis", "relative_day"]),
    T("who won the most medals yesterday", "most_medals", {"date": YESTERDAY}, focus="who",
      says=gnames(most(date=YESTERDAY)[0]), tags=["relative_day", "constraint"]),
    T("which delegation won most on thursday", "most_medals", {"date": "2027-08-12"}, focus="who",
      says=gnames(most(date="2027-08-12")[0]), tags=["constraint", "follow_up"]),
    T("what was on that day in the pool", "schedule_day", {"date": "2027-08-12", "sport": "swimming"},
      focus="schedule", says=[hhmm(c) for c in schedule("2027-08-12", "swimming")],
      tags=["follow_up", "constraint"]),
))
assert group_count("kalvenmark", date=TODAY) == 0

add(CONV(["cross_contest", "uncovered"],
    U("which athlete has won the most golds at these games", focus="who", tags=["cross_contest"]),
    T("ok how many golds has tetha brelwick won", "competitor_medals",
      {"competitor": BRELWICK, "award": "gold"}, focus="count",
      says=[count_word(medals_of(BRELWICK, "gold"))]),
    T("in what", "competitor_profile", {"competitor": BRELWICK}, focus="profile",
      says=disciplines_of(BRELWICK), tags=["follow_up", "ellipsis"]),
    T("did she beat dasonert both times", "head_to_head", {"competitor": BRELWICK, "rival": DASONERT},
      focus="whether", says=[pname(BRELWICK)], tags=["follow_up", "partial", "cross_contest"]),
    T("what was the gap in the time trial", "competitor_margin", {"competitor": BRELWICK, "contest": WTT},
      focus="margin", says=[winner_margin(WTT)], tags=["follow_up", "constraint"]),
))
assert all(ahead(BRELWICK, DASONERT, c) == pname(BRELWICK) for c in (WRR, WTT))
assert at_place(WTT, 2) == [pname(DASONERT)]

add(CONV(["schedule", "place"],
    U("whats happening at the stadium tomorrow", focus="schedule",
      never=[hhmm(c) for c in schedule(TOMORROW) if CON[c].get("venue") != "Lowenfirth Coast Stadium"],
      tags=["constraint", "relative_day"]),
    T("ok just whats on tomorrow then", "schedule_day", {"date": TOMORROW}, focus="schedule",
      says=[hhmm(c) for c in schedule(TOMORROW)], tags=["follow_up", "relative_day"]),
    T("where is the medley", "contest_time", {"contest": W400IM}, focus="where",
      says=[CON[W400IM]["venue"]], tags=["follow_up", "partial"]),
    T("and the mens medley, when is that", "contest_time", {"contest": M400IM}, focus="when",
      says=[hhmm(M400IM)], tags=["follow_up"]),
    T("who's swimming in the mens one", "full_results", {"contest": M400IM}, focus="results",
      outcome="no_data", tags=["follow_up", "uncovered"]),
))
assert CON[M400IM]["entries"] == []

add(CONV(["live", "high_jump"],
    T("hows the high jump going", "live_leader", {"contest": MHJ}, focus="who",
      says=[at_place(MHJ, 1)[0], fmt_mark(MHJ, ranked(MHJ)[0]["mark"])], tags=["contraction"]),
    U("what height is the bar at now", focus="mark", tags=["follow_up"]),
    T("how high has thadach cossasko gone", "competitor_result", {"competitor": COSSASKO, "contest": MHJ},
      focus="mark", says=result_facts(COSSASKO, MHJ)),
    T("is he ahead of korvace", "head_to_head", {"competitor": COSSASKO, "rival": KORVACE, "contest": MHJ},
      focus="whether", says=[ahead(COSSASKO, KORVACE, MHJ)], tags=["follow_up", "partial"]),
    T("when do the women jump", "contest_time", {"contest": WHJ}, focus="when",
      says=[hhmm(WHJ)], tags=["follow_up", "ellipsis"]),
))

add(CONV(["voice", "mishearing", "diacritics"],
    T("who won the womens javelin was it lucia wendero", "podium", {"contest": WJAV},
      says=[at_place(WJAV, 1)[0]], tags=["voice", "mishearing"]),
    T("how far did she throw", "competitor_result", {"competitor": WENDEROW, "contest": WJAV},
      focus="mark", says=[fmt_mark(WJAV, entry_of(WENDEROW, WJAV)["mark"])], tags=["voice", "pronoun"]),
    T("and the silver medal", "medalist", {"contest": WJAV, "award": "silver"},
      says=with_award(WJAV, "silver"), tags=["voice", "ellipsis"]),
    T("where is sevora gurn from", "competitor_delegation", {"competitor": GURRORN},
      focus="group_of", says=[G(group_of(GURRORN))], tags=["voice", "mishearing"]),
    T("what else has sordavia won", "delegation_medals", {"group": "sordavia"}, focus="count",
      says=[count_word(group_count("sordavia"))], tags=["voice", "follow_up"]),
))

add(CONV(["middle_distance"],
    T("metric mile results for the men", "full_results", {"contest": M1500}, focus="results",
      says=[entrant(e) for e in ranked(M1500, 3)] + [fmt_mark(M1500, ranked(M1500)[0]["mark"])],
      tags=["alias"]),
    T("what happened to krurvasko", "competitor_result", {"competitor": KRURVASKO, "contest": M1500},
      focus="how_did", never=[ordinal(len(CON[M1500]["entries"]))], tags=["follow_up", "partial"]),
    T("and the womens winner", "podium", {"contest": W1500}, says=[at_place(W1500, 1)[0]],
      tags=["follow_up", "ellipsis"]),
    T("her time?", "competitor_result", {"competitor": HERVACE, "contest": W1500}, focus="mark",
      says=[fmt_mark(W1500, entry_of(HERVACE, W1500)["mark"])], tags=["follow_up", "pronoun"]),
    T("thanks, who was fourth", "contest_place", {"contest": W1500, "place": "4"}, focus="who",
      says=at_place(W1500, 4), tags=["thanks_between", "follow_up", "number_words"]),
))
assert entry_of(KRURVASKO, M1500).get("status") == "dns"

add(CONV(["swimming", "alias"],
    T("what does jory swim", "competitor_sport", {"competitor": HALMVIK}, focus="sport_of",
      says=disciplines_of(HALMVIK), tags=["alias"]),
    T("which country", "competitor_delegation", {"competitor": HALMVIK}, focus="group_of",
      says=[G(group_of(HALMVIK))], tags=["follow_up", "ellipsis"]),
    T("how did he do in the 200 free", "competitor_result", {"competitor": HALMVIK, "contest": M200FR},
      focus="how_did", says=result_facts(HALMVIK, M200FR), tags=["follow_up", "pronoun"]),
    T("who beat him", "competitor_margin", {"competitor": HALMVIK, "contest": M200FR}, focus="who",
      says=[at_place(M200FR, 1)[0], winner_margin(M200FR)], tags=["follow_up", "pronoun"]),
    T("did he medal in the breaststroke", "competitor_result", {"competitor": HALMVIK, "contest": M100BR},
      focus="whether", says=[ordinal(entry_of(HALMVIK, M100BR)["place"])], tags=["follow_up"]),
    T("whats the fastest mens 100 breast so far", "best_mark",
      {"discipline": "swimming/100m-breaststroke", "category": "men"}, focus="mark",
      says=[best_mark("swimming", "100m-breaststroke", "men")], tags=["alias", "follow_up"]),
))

add(CONV(["by_sport"],
    T("medal table for gymnastics", "medal_table_top", {"sport": "gymnastics"}, focus="table",
      says=gnames(top(1, "gymnastics")), tags=["constraint", "terse"]),
    T("who's on top in cycling", "medal_table_leader", {"sport": "cycling"}, focus="who",
      says=gnames(leaders("cycling")), tags=["constraint", "follow_up"]),
    T("how many cycling medals does myrrhaven have", "delegation_medals",
      {"group": "myrrhaven", "sport": "cycling"}, focus="count",
      says=[count_word(group_count("myrrhaven", sport="cycling"))],
      never=[count_word(group_count("myrrhaven"))], tags=["constraint"]),
    U("and which of their riders won them", focus="who", tags=["follow_up", "pronoun"]),
    T("renee ostravin, what did she do in the road race", "competitor_result",
      {"competitor": OSTRAVIN, "contest": WRR}, focus="how_did", says=result_facts(OSTRAVIN, WRR),
      tags=["diacritics"]),
))

add(CONV(["long_jump"],
    T("long jump ladies, who got gold", "medalist", {"contest": WLJ, "award": "gold"},
      says=with_award(WLJ, "gold"), tags=["chatty"]),
    T("how much did she win it by", "competitor_margin", {"competitor": HERVOVETH, "contest": WLJ}, focus="margin",
      says=[winner_margin(WLJ), at_place(WLJ, 2)[0]], tags=["follow_up", "ellipsis"]),
    T("what did rhea maud jump", "competitor_result", {"competitor": OCARROWIN, "contest": WLJ},
      focus="mark", says=[fmt_mark(WLJ, entry_of(OCARROWIN, WLJ)["mark"])], tags=["partial"]),
    T("where is she from", "competitor_delegation", {"competitor": OCARROWIN}, focus="group_of",
      says=[G(group_of(OCARROWIN))], tags=["follow_up", "pronoun"]),
    T("has welkmarsh won any medals at all", "delegation_medals", {"group": "welkmarsh"},
      focus="whether", tags=["follow_up"]),
    U("which delegations are still waiting for their first medal", focus="who",
      tags=["cross_contest"]),
))
assert group_count("welkmarsh") == 0

add(CONV(["head_to_head", "tie"],
    T("who finished higher in the 100 free final, zoe quillon or pevelle cosevmont", "head_to_head",
      {"competitor": QUILLON, "rival": COSEVMONT, "contest": W100FR}, focus="compare",
      says=[ahead(QUILLON, COSEVMONT, W100FR)], tags=["diacritics", "alias"]),
    T("what about the 200 free, quillon v brussand", "head_to_head",
      {"competitor": QUILLON, "rival": BRUSSAND, "contest": W200FR}, focus="compare",
      says=[fmt_mark(W200FR, entry_of(QUILLON, W200FR)["mark"])], tags=["follow_up", "tie", "partial"]),
    T("so who got bronze in that one", "medalist", {"contest": W200FR, "award": "bronze"},
      outcome="no_data", tags=["follow_up", "tie"]),
    T("who won it", "podium", {"contest": W200FR}, says=[at_place(W200FR, 1)[0]],
      tags=["follow_up", "pronoun"]),
    T("what delegation", "competitor_delegation", {"competitor": HANTANDAL}, focus="group_of",
      says=[G(group_of(HANTANDAL))], tags=["follow_up", "ellipsis"]),
))
assert entry_of(QUILLON, W200FR)["mark"] == entry_of(BRUSSAND, W200FR)["mark"]
assert with_award(W200FR, "bronze") == []

add(CONV(["delegation_event"],
    T("how did tolmerin do in the women's 200 fly", "delegation_in_event",
      {"group": "tolmerin", "contest": W200FLY}, focus="how_did",
      says=[pname(ent_in_group("tolmerin", W200FLY)["competitor"]),
            ent_in_group("tolmerin", W200FLY)["award"]], tags=["alias"]),
    T("and in the mens", "delegation_in_event", {"group": "tolmerin", "contest": M200FLY},
      focus="how_did", says=[pname(ent_in_group("tolmerin", M200FLY)["competitor"]),
                             ordinal(ent_in_group("tolmerin", M200FLY)["place"])],
      tags=["follow_up", "ellipsis"]),
    T("tolmerin's total medal count?", "delegation_medals", {"group": "tolmerin"}, focus="count",
      says=[count_word(group_count("tolmerin"))]),
    T("rank?", "delegation_medals", {"group": "tolmerin"}, focus="rank",
      says=[group_rank("tolmerin")], tags=["follow_up", "ellipsis", "terse", "tie"]),
    U("who else is level with them on medals", focus="who", tags=["follow_up"]),
    T("thank you", "thanks", focus="chat"),
))

add(CONV(["uncovered", "stats"],
    U("any world records so far"),
    U("who holds the games record in the 100m", focus="mark"),
    U("how many athletes has kalvenmark brought", focus="count"),
    T("ok how many golds have they won then", "delegation_medals", {"group": "kalvenmark", "award": "gold"},
      focus="count", says=[count_word(group_count("kalvenmark", award="gold"))], tags=["follow_up", "pronoun"]),
    U("which sport did they do best in", focus="sport_of", tags=["follow_up", "pronoun", "cross_contest"]),
))

add(CONV(["next", "diacritics"],
    T("when does anais cordvelle race next", "competitor_next", {"competitor": CORDVELLE}, focus="when",
      says=[hhmm(next_contest(CORDVELLE))], tags=["diacritics"]),
    T("where", "contest_time", {"contest": next_contest(CORDVELLE)}, focus="where",
      says=[CON[next_contest(CORDVELLE)]["venue"]], tags=["follow_up", "ellipsis", "terse"]),
    T("how did she do in her heat", "competitor_result", {"competitor": CORDVELLE, "contest": W100H1},
      focus="how_did", says=result_facts(CORDVELLE, W100H1), tags=["follow_up", "constraint"]),
    T("has she got any medals yet", "competitor_medals", {"competitor": CORDVELLE}, focus="whether",
      tags=["follow_up"]),
    T("what did she run in the 200", "competitor_result", {"competitor": CORDVELLE, "contest": W200},
      focus="mark", says=result_facts(CORDVELLE, W200), tags=["follow_up"]),
))
assert medals_of(CORDVELLE) == 0 and next_contest(CORDVELLE) == W100

add(CONV(["live", "javelin"],
    T("javelin update pls", "live_leader", {"contest": MJAV}, focus="who",
      says=[at_place(MJAV, 1)[0]], tags=["terse", "chatty"]),
    T("who's third", "contest_place", {"contest": MJAV, "place": "3"}, focus="who",
      says=at_place(MJAV, 3), tags=["follow_up", "number_words"]),
    T("how far has storrek tarvago thrown", "competitor_result", {"competitor": TARVAGO, "contest": MJAV},
      focus="mark", says=[fmt_mark(MJAV, entry_of(TARVAGO, MJAV)["mark"])]),
    T("who won the women's javelin earlier in the week", "podium", {"contest": WJAV},
      says=[at_place(WJAV, 1)[0]], tags=["new_question"]),
    T("is the men's one over yet", "live_leader", {"contest": MJAV}, focus="status",
      tags=["follow_up", "contraction"]),
))

add(CONV(["voice", "number_words"],
    T("who won the four hundred metres men", "podium", {"contest": M400}, says=[at_place(M400, 1)[0]],
      tags=["voice", "number_words"]),
    T("what was the winning time", "competitor_result", {"competitor": TRILUNICK, "contest": M400},
      focus="mark", says=[fmt_mark(M400, entry_of(TRILUNICK, M400)["mark"])], tags=["voice", "follow_up"]),
    T("an the womens", "podium", {"contest": W400}, says=[at_place(W400, 1)[0]],
      tags=["voice", "follow_up", "ellipsis", "misspelling"]),
    T("what about drada brorrorn", "competitor_result", {"competitor": BRORRORN, "contest": W400},
      focus="how_did", never=[ordinal(len(CON[W400]["entries"]))], tags=["voice", "follow_up"]),
    T("which country is she from", "competitor_delegation", {"competitor": BRORRORN}, focus="group_of",
      says=[G(group_of(BRORRORN))], tags=["voice", "pronoun"]),
))
assert entry_of(BRORRORN, W400).get("status") == "dsq"

add(CONV(["help", "schedule"],
    T("hello what can you tell me", "help", focus="chat", tags=["chatty"]),
    T("ok what's on monday", "schedule_day", {"date": "2027-08-16"}, focus="schedule",
      says=[hhmm(c) for c in schedule("2027-08-16")], tags=["follow_up"]),
    T("any rowing", "schedule_day", {"date": "2027-08-16", "sport": "rowing"}, focus="schedule",
      says=[hhmm(c) for c in schedule("2027-08-16", "rowing")], tags=["follow_up", "constraint", "terse"]),
    T("and tuesday, everything", "schedule_day", {"date": "2027-08-17"}, focus="schedule",
      says=[hhmm(c) for c in schedule("2027-08-17")], tags=["follow_up", "ellipsis"]),
    U("when is the closing ceremony", focus="when", tags=["new_question"]),
))

add(CONV(["high_jump", "attributes"],
    T("what sport is lomov kerreth", "competitor_sport", {"competitor": KERRETH}, focus="sport_of",
      says=[PER[KERRETH]["sport"], disciplines_of(KERRETH)[0]]),
    T("is he winning", "live_leader", {"contest": MHJ}, focus="whether",
      says=[at_place(MHJ, 1)[0]], tags=["follow_up", "pronoun"]),
    T("which delegation", "competitor_delegation", {"competitor": KERRETH}, focus="group_of",
      says=[G(group_of(KERRETH))], tags=["follow_up", "ellipsis"]),
    T("how many medals does pellavia have", "delegation_medals", {"group": "pellavia"}, focus="count",
      says=[count_word(group_count("pellavia"))]),
    U("do you reckon he'll get them a gold tonight", focus="whether", tags=["follow_up", "prediction"]),
))

add(CONV(["clarify", "missing_category"],
    T("who won the 100m", "podium", {}, outcome="clarify", tags=["ambiguous", "missing_slot"]),
    T("the mens", "podium", {"contest": M100}, says=[at_place(M100, 1)[0]], tags=["clarify", "follow_up"]),
    U("and who's favourite for the women's", focus="who", tags=["follow_up", "prediction"]),
    T("fine, when is it", "contest_time", {"contest": W100}, focus="when", says=[hhmm(W100)],
      tags=["follow_up", "pronoun"]),
))

add(CONV(["gymnastics", "thanks_between"],
    T("who won gold in the men's floor", "medalist", {"contest": MFL, "award": "gold"},
      says=with_award(MFL, "gold")),
    T("thanks!", "thanks", focus="chat"),
    T("one more, who won the men's all-around", "podium", {"contest": MAA}, says=[at_place(MAA, 1)[0]],
      tags=["thanks_between", "new_question"]),
    T("his score", "competitor_result", {"competitor": ZILKEDORN, "contest": MAA}, focus="mark",
      says=[entry_of(ZILKEDORN, MAA)["mark"]], tags=["follow_up", "terse"]),
    T("and what did he do on floor", "competitor_result", {"competitor": ZILKEDORN, "contest": MFL},
      focus="how_did", says=result_facts(ZILKEDORN, MFL), tags=["follow_up", "pronoun"]),
))

add(CONV(["return_to_subject"],
    T("how did halvorne do in the womens 400", "delegation_in_event", {"group": "halvorne", "contest": W400},
      focus="how_did", says=[pname(ent_in_group("halvorne", W400)["competitor"])]),
    T("btw what time is the womens vault", "contest_time", {"contest": WVT}, focus="when",
      says=[hhmm(WVT), CON[WVT]["venue"]], tags=["new_question"]),
    T("back to halvorne, how many medals", "delegation_medals", {"group": "halvorne"}, focus="count",
      says=[count_word(group_count("halvorne"))], tags=["return"]),
    T("golds?", "delegation_medals", {"group": "halvorne", "award": "gold"}, focus="count",
      says=[count_word(group_count("halvorne", award="gold"))], tags=["follow_up", "ellipsis", "terse"]),
    T("and their position in the table", "delegation_medals", {"group": "halvorne"}, focus="rank",
      says=[group_rank("halvorne")], tags=["follow_up", "pronoun"]),
))

add(CONV(["by_sport", "award"],
    T("how many golds has kalvenmark won in athletics", "delegation_medals",
      {"group": "kalvenmark", "sport": "athletics", "award": "gold"}, focus="count",
      says=[count_word(group_count("kalvenmark", "athletics", award="gold"))],
      never=[count_word(group_count("kalvenmark", award="gold"))], tags=["constraint"]),
    T("and on the water", "delegation_medals", {"group": "kalvenmark", "sport": "rowing", "award": "gold"},
      focus="count", says=[count_word(group_count("kalvenmark", "rowing", award="gold"))],
      tags=["follow_up", "ellipsis", "constraint"]),
    T("who leads the athletics medal table", "medal_table_leader", {"sport": "athletics"}, focus="who",
      says=gnames(leaders("athletics")), tags=["constraint"]),
    T("top three in swimming", "medal_table_top", {"sport": "swimming", "count": "3"}, focus="table",
      says=gnames(top(3, "swimming")), tags=["constraint", "number_words", "terse"]),
    T("who has the most bronzes overall", "most_medals", {"award": "bronze"}, focus="who",
      says=gnames(most(award="bronze")[0]), tags=["tie"]),
))
assert group_count("kalvenmark", "rowing", award="gold") > 0

add(CONV(["voice", "swimming"],
    T("hey tidings who won the men's two hundred free", "podium", {"contest": M200FR},
      says=[at_place(M200FR, 1)[0]], tags=["voice", "number_words", "alias"]),
    T("what nationality is he", "competitor_delegation", {"competitor": FUSTISESSI}, focus="group_of",
      says=[G(group_of(FUSTISESSI))], tags=["voice", "pronoun"]),
    T("what other events is he in", "competitor_sport", {"competitor": FUSTISESSI}, focus="sport_of",
      says=[d for d in disciplines_of(FUSTISESSI) if d != disc_name(M200FR)], tags=["voice", "follow_up"]),
    T("how did he do there", "competitor_result", {"competitor": FUSTISESSI, "contest": M100BR},
      focus="how_did", says=result_facts(FUSTISESSI, M100BR), tags=["voice", "follow_up", "pronoun"]),
))
assert disciplines_of(FUSTISESSI) == ["200 m freestyle", "100 m breaststroke"]

add(CONV(["tie", "swimming"],
    T("who got silver in the women's 200 freestyle", "medalist", {"contest": W200FR, "award": "silver"},
      says=with_award(W200FR, "silver"), tags=["tie"]),
    T("how many medals has hurra brussand got", "competitor_medals", {"competitor": BRUSSAND},
      focus="count", says=[count_word(medals_of(BRUSSAND))]),
    T("what country", "competitor_delegation", {"competitor": BRUSSAND}, focus="group_of",
      says=[G(group_of(BRUSSAND))], tags=["follow_up", "ellipsis", "terse"]),
    T("and their tally", "delegation_medals", {"group": group_of(BRUSSAND)}, focus="count",
      says=[count_word(group_count(group_of(BRUSSAND)))], tags=["follow_up", "pronoun"]),
))

add(CONV(["cycling"],
    T("road race men who won", "podium", {"contest": MRR}, says=[at_place(MRR, 1)[0]], tags=["terse"]),
    T("is zevert in the time trial", "competitor_next", {"competitor": ZEVERT}, focus="whether",
      says=[hhmm(next_contest(ZEVERT))], tags=["follow_up", "partial"]),
    T("where is that held", "contest_time", {"contest": MTT}, focus="where",
      says=[CON[MTT]["venue"]], tags=["follow_up", "pronoun"]),
    T("who won the womens tt", "podium", {"contest": WTT}, says=[at_place(WTT, 1)[0]],
      tags=["alias", "new_question"]),
))
assert next_contest(ZEVERT) == MTT

add(CONV(["profile", "head_to_head"],
    T("tell me about hothic nuvasko", "competitor_profile", {"competitor": NUVASKO}, focus="profile",
      says=disciplines_of(NUVASKO)),
    T("how many golds", "competitor_medals", {"competitor": NUVASKO, "award": "gold"}, focus="count",
      says=[count_word(medals_of(NUVASKO, "gold"))], tags=["follow_up", "ellipsis"]),
    T("who's he swim for", "competitor_delegation", {"competitor": NUVASKO}, focus="group_of",
      says=[G(group_of(NUVASKO))], tags=["follow_up", "pronoun", "contraction"]),
    T("did he beat guntasand in the fly", "head_to_head",
      {"competitor": NUVASKO, "rival": GUNTASAND, "contest": M200FLY}, focus="whether",
      says=[ahead(NUVASKO, GUNTASAND, M200FLY)], tags=["follow_up", "partial", "alias"]),
    T("and in the 100 free?", "head_to_head", {"competitor": NUVASKO, "rival": GUNTASAND, "contest": M100FR},
      focus="compare", says=[ahead(NUVASKO, GUNTASAND, M100FR)], tags=["follow_up", "ellipsis"]),
))

add(CONV(["uncovered", "stats"],
    U("what was the wind reading in the men's 100 final", focus="mark"),
    U("can i get the lap splits for the men's 1500", focus="results"),
    U("how many people were at the basketball final", focus="count"),
    T("ok, who was 3rd in the mens 1500", "contest_place", {"contest": M1500, "place": "3"}, focus="who",
      says=at_place(M1500, 3), tags=["new_question"]),
))

add(CONV(["no_data", "events_missing"],
    T("who won the men's 10000", "podium", {}, outcome="no_data",
      never=[at_place(M1500, 1)[0]], tags=["uncovered"]),
    T("the 5000 then", "podium", {}, outcome="no_data", never=[at_place(M1500, 1)[0]],
      tags=["follow_up", "ellipsis", "uncovered"]),
    T("ok the womens marathon", "podium", {"contest": WMAR}, says=[at_place(WMAR, 1)[0]],
      tags=["follow_up"]),
    T("her time", "competitor_result", {"competitor": ZULREN, "contest": WMAR}, focus="mark",
      says=[fmt_mark(WMAR, entry_of(ZULREN, WMAR)["mark"])], tags=["follow_up", "pronoun", "terse"]),
    T("who was closest to her", "competitor_margin", {"competitor": ZULREN, "contest": WMAR},
      focus="who", says=at_place(WMAR, 2), tags=["follow_up", "pronoun"]),
))

add(CONV(["restriction", "uncovered"],
    U("how many medals has quessary won in womens events", focus="count",
      never=[str(group_count("quessary"))], tags=["constraint"]),
    T("ok overall then", "delegation_medals", {"group": "quessary"}, focus="count",
      says=[str(group_count("quessary"))], tags=["follow_up", "ellipsis"]),
    U("how many of those came at the aquatic centre", focus="count",
      never=[str(group_count("quessary"))], tags=["follow_up", "constraint"]),
    T("and in swimming", "delegation_medals", {"group": "quessary", "sport": "swimming"}, focus="count",
      says=[count_word(group_count("quessary", "swimming"))], tags=["follow_up", "constraint"]),
))

add(CONV(["marathon", "live"],
    T("whos leading the marathon", "live_leader", {"contest": MMAR}, focus="who",
      says=at_place(MMAR, 1), tags=["contraction"]),
    T("what position is inigo saltreva in", "competitor_result", {"competitor": SALTREVA, "contest": MMAR},
      focus="how_did", says=[ordinal(entry_of(SALTREVA, MMAR)["place"])], tags=["diacritics", "follow_up"]),
    T("how far behind the leader is he", "competitor_margin", {"competitor": SALTREVA, "contest": MMAR},
      focus="margin", says=at_place(MMAR, 1), tags=["follow_up", "pronoun"]),
    U("how many km have they done", focus="status", tags=["follow_up"]),
    T("who won the women's race", "podium", {"contest": WMAR}, says=[at_place(WMAR, 1)[0]],
      never=at_place(MMAR, 1), tags=["follow_up", "ellipsis"]),
))

add(CONV(["attributes", "cross_contest"],
    T("what sport does mårten quellby do", "competitor_sport", {"competitor": QUELLBY}, focus="sport_of",
      says=[PER[QUELLBY]["sport"]], tags=["diacritics"]),
    T("who does he represent", "competitor_delegation", {"competitor": QUELLBY}, focus="group_of",
      says=[G(group_of(QUELLBY))], tags=["follow_up", "pronoun"]),
    T("how'd he go in the floor", "competitor_result", {"competitor": QUELLBY, "contest": MFL},
      focus="how_did", says=result_facts(QUELLBY, MFL), tags=["follow_up", "contraction"]),
    U("is he the oldest gymnast here", focus="other", tags=["follow_up"]),
    T("who came second on floor", "contest_place", {"contest": MFL, "place": "2"}, focus="who",
      says=at_place(MFL, 2), tags=["follow_up"]),
))

add(CONV(["not_in_any_event"],
    T("what events is gethard vamwick in", "competitor_sport", {"competitor": VAMWICK}, focus="sport_of",
      says=[PER[VAMWICK]["sport"]]),
    T("how has he done so far", "competitor_profile", {"competitor": VAMWICK}, focus="profile",
      outcome="no_data", tags=["follow_up", "pronoun"]),
    T("which delegation is he with", "competitor_delegation", {"competitor": VAMWICK}, focus="group_of",
      says=[G(group_of(VAMWICK))], tags=["follow_up"]),
    U("is he injured", focus="other", tags=["follow_up"]),
))
assert contests_of(VAMWICK) == []

add(CONV(["double_sculls", "team"],
    T("who took the men's double sculls", "podium", {"contest": M2X}, says=with_award(M2X, "gold")),
    T("and silver", "medalist", {"contest": M2X, "award": "silver"}, says=with_award(M2X, "silver"),
      tags=["follow_up", "ellipsis"]),
    T("their time?", "full_results", {"contest": M2X, "count": "1"}, focus="mark",
      says=[fmt_mark(M2X, ranked(M2X)[0]["mark"])], tags=["follow_up"]),
    T("how did welkmarsh do in it", "delegation_in_event", {"group": "welkmarsh", "contest": M2X},
      focus="how_did", says=[ordinal(ent_in_group("welkmarsh", M2X)["place"])], tags=["follow_up", "pronoun"]),
    T("how many medals has dunmerrow got", "delegation_medals", {"group": "dunmerrow"}, focus="count",
      says=[count_word(group_count("dunmerrow"))], tags=["new_question"]),
    T("what about just today", "delegation_medals", {"group": "dunmerrow", "date": TODAY}, focus="count",
      says=[count_word(group_count("dunmerrow", date=TODAY))], tags=["follow_up", "relative_day"]),
))

add(CONV(["typos"],
    T("whoo won teh womens all aroud", "podium", {"contest": WAA}, outcome="no_data",
      tags=["misspelling", "uncovered"]),
    T("ok whos leading it", "live_leader", {"contest": WAA}, focus="who", says=[at_place(WAA, 1)[0]],
      tags=["follow_up", "pronoun"]),
    T("and the mens all aroud who won", "podium", {"contest": MAA}, says=[at_place(MAA, 1)[0]],
      tags=["misspelling", "follow_up"]),
    T("silvr?", "medalist", {"contest": MAA, "award": "silver"}, says=with_award(MAA, "silver"),
      tags=["misspelling", "ellipsis", "terse"]),
    T("brnze", "medalist", {"contest": MAA, "award": "bronze"}, says=with_award(MAA, "bronze"),
      tags=["misspelling", "ellipsis", "terse"]),
))

add(CONV(["uncovered", "media"],
    U("what channel is the marathon on"),
    U("can i still get tickets for the women's basketball final"),
    T("what time is it on", "contest_time", {"contest": WBK}, focus="when", says=[hhmm(WBK)],
      tags=["follow_up", "pronoun"]),
    T("which teams are playing", "full_results", {"contest": WBK}, focus="results",
      says=[entrant(e) for e in CON[WBK]["entries"]], tags=["follow_up"]),
))

add(CONV(["compare", "sprint"],
    T("who was faster in the mens 100 final hinell or zorvren", "head_to_head",
      {"competitor": HINELL, "rival": ZORVREN, "contest": M100}, focus="compare",
      says=[ahead(HINELL, ZORVREN, M100)], tags=["partial"]),
    U("how far off a medal was hinell", focus="margin",
      never=[fmt_gap(M100, entry_of(HINELL, M100)["mark"], ranked(M100)[0]["mark"])],
      tags=["follow_up", "constraint"]),
    T("did tollevant make the final", "competitor_result", {"competitor": TOLLEVANT, "contest": M100},
      focus="whether", says=result_facts(TOLLEVANT, M100), tags=["partial", "diacritics"]),
    T("and who won his heat", "contest_place", {"contest": M100H1, "place": "1"}, focus="who",
      says=at_place(M100H1, 1), tags=["follow_up", "pronoun", "constraint"]),
))

add(CONV(["mishearing", "voice"],
    T("how did susust horell do in the 200", "competitor_result", {"competitor": HARRELL, "contest": M200},
      focus="how_did", says=result_facts(HARRELL, M200), tags=["voice", "mishearing"]),
    T("and banek harrell", "competitor_result", {"competitor": HORELL, "contest": M200},
      focus="how_did", says=result_facts(HORELL, M200), tags=["voice", "mishearing", "follow_up"]),
    T("which of them was quicker", "head_to_head", {"competitor": HARRELL, "rival": HORELL, "contest": M200},
      focus="compare", says=[ahead(HARRELL, HORELL, M200)], tags=["voice", "follow_up", "pronoun"]),
    T("what country is banek from", "competitor_delegation", {"competitor": HORELL}, focus="group_of",
      says=[G(group_of(HORELL))], tags=["voice", "partial"]),
))

add(CONV(["dsq", "swimming"],
    T("full results mens 100 breaststroke", "full_results", {"contest": M100BR}, focus="results",
      says=[entrant(e) for e in ranked(M100BR, 3)], tags=["terse"]),
    T("why was kromwick disqualified", "none", focus="other", outcome="not_covered",
      tags=["uncovered", "follow_up", "partial"]),
    T("what else did he swim", "competitor_sport", {"competitor": KROMWICK}, focus="sport_of",
      says=[d for d in disciplines_of(KROMWICK) if d != disc_name(M100BR)], tags=["follow_up"]),
    T("how did he do in that", "competitor_result", {"competitor": KROMWICK, "contest": M200FLY},
      focus="how_did", says=result_facts(KROMWICK, M200FLY), tags=["follow_up", "pronoun"]),
))
assert entry_of(KROMWICK, M100BR).get("status") == "dsq"
assert disciplines_of(KROMWICK) == ["200 m butterfly", "100 m breaststroke"]

add(CONV(["best_mark"],
    T("whats the longest mens long jump so far", "best_mark",
      {"discipline": "athletics/long-jump", "category": "men"}, focus="mark",
      says=[best_mark("athletics", "long-jump", "men")]),
    T("and for the women", "best_mark", {"discipline": "athletics/long-jump", "category": "women"},
      focus="mark", says=[best_mark("athletics", "long-jump", "women")],
      never=[best_mark("athletics", "long-jump", "men")], tags=["follow_up", "ellipsis"]),
    T("best score on the women's floor", "best_mark", {"discipline": "gymnastics/floor", "category": "women"},
      focus="mark", says=[best_mark("gymnastics", "floor", "women")]),
    T("fastest 200 fly by a woman", "best_mark", {"discipline": "swimming/200m-butterfly", "category": "women"},
      focus="mark", says=[best_mark("swimming", "200m-butterfly", "women")], tags=["alias"]),
    T("and the highest high jump so far for the men", "best_mark",
      {"discipline": "athletics/high-jump", "category": "men"}, focus="mark",
      says=[best_mark("athletics", "high-jump", "men")], tags=["live"]),
    U("whats the best ever time in the womens 200 fly", focus="mark",
      never=[best_mark("swimming", "200m-butterfly", "women")], tags=["follow_up"]),
))

add(CONV(["heats", "round"],
    T("fastest time in the men's 100 heats", "best_mark",
      {"discipline": "athletics/100m", "category": "men", "round": "heat"}, focus="mark",
      says=[best_mark("athletics", "100m", "men", "heat")],
      never=[best_mark("athletics", "100m", "men")], tags=["constraint"]),
    T("and overall including the final", "best_mark", {"discipline": "athletics/100m", "category": "men"},
      focus="mark", says=[best_mark("athletics", "100m", "men")], tags=["follow_up"]),
    T("results of heat one", "full_results", {"contest": M100H1}, focus="results",
      says=[entrant(e) for e in ranked(M100H1, 3)], tags=["follow_up", "number_words"]),
    U("who had the best reaction time", focus="mark", tags=["follow_up"]),
))

add(CONV(["gymnastics", "vault"],
    T("when's the women's vault final", "contest_time", {"contest": WVT}, focus="when",
      says=[hhmm(WVT)], tags=["contraction", "alias"]),
    T("who won it then, has it happened", "podium", {"contest": WVT}, outcome="no_data", tags=["follow_up", "pronoun"]),
    T("is keraland in it", "competitor_next", {"competitor": KERALAND}, focus="whether",
      says=[hhmm(WVT)], tags=["follow_up", "partial"]),
    T("how did she do on floor", "competitor_result", {"competitor": KERALAND, "contest": WFL},
      focus="how_did", says=result_facts(KERALAND, WFL), tags=["follow_up", "pronoun"]),
))
assert next_contest(KERALAND) == WVT and WAA not in contests_of(KERALAND)

add(CONV(["under_way"],
    T("is there any gymnastics on right now", "under_way", {"sport": "gymnastics"}, focus="status",
      says=[disc_name(c) for c in live("gymnastics")], never=[disc_name(MJAV)], tags=["constraint"]),
    T("and athletics", "under_way", {"sport": "athletics"}, focus="schedule",
      says=[disc_name(c) for c in live("athletics")], tags=["follow_up", "ellipsis", "constraint"]),
    T("anything in the pool", "under_way", {"sport": "swimming"}, focus="schedule",
      never=[disc_name(MJAV), disc_name(MMAR)], tags=["follow_up", "constraint"]),
    T("what's on in the pool tomorrow then", "schedule_day", {"date": TOMORROW, "sport": "swimming"},
      focus="schedule", says=[hhmm(c) for c in schedule(TOMORROW, "swimming")], tags=["relative_day", "follow_up"]),
))
assert live("swimming") == []

add(CONV(["women_basketball", "team"],
    T("when does virrisse condmont play next", "competitor_next", {"competitor": CONDMONT}, focus="when",
      says=[hhmm(next_contest(CONDMONT))]),
    T("which team is she on", "competitor_delegation", {"competitor": CONDMONT}, focus="group_of",
      says=[G(group_of(CONDMONT))], tags=["follow_up", "pronoun"]),
    T("what sport is that again", "competitor_sport", {"competitor": CONDMONT}, focus="sport_of",
      says=[PER[CONDMONT]["sport"]], tags=["follow_up"]),
    U("how many points does she average", focus="mark", tags=["follow_up", "pronoun"]),
))

add(CONV(["medal_table", "date"],
    T("who won the most golds today", "most_medals", {"date": TODAY, "award": "gold"}, focus="who",
      says=gnames(most(date=TODAY, award="gold")[0]), tags=["relative_day", "constraint"]),
    T("and who topped the table on the first day", "medal_table_leader", {"date": "2027-08-09"},
      focus="who", says=gnames(leaders(date="2027-08-09")), tags=["constraint"]),
    T("who's ahead on golds alone", "medal_table_leader", {"award": "gold"}, focus="who",
      says=gnames(leaders(award="gold")), tags=["constraint", "contraction"]),
    U("which delegation has the most finalists", focus="who", tags=["cross_contest"]),
))
assert min(c["start"][:10] for c in CONTESTS) == "2027-08-09"

add(CONV(["chit_chat"],
    T("good evening", "greeting", focus="chat"),
    NU("can you order me a pizza"),
    T("haha ok then. who's won the men's basketball", "podium", {"contest": MBK},
      says=with_award(MBK, "gold"), tags=["chatty"]),
    T("and who finished fourth", "contest_place", {"contest": MBK, "place": "4"}, focus="who",
      says=at_place(MBK, 4), tags=["follow_up", "number_words"]),
    T("brilliant, ta", "thanks", focus="chat"),
))

add(CONV(["rowing", "women"],
    T("womens single sculls winner", "podium", {"contest": W1X}, says=[at_place(W1X, 1)[0]], tags=["terse"]),
    T("whats her time", "competitor_result", {"competitor": PER[ranked(W1X)[0]["competitor"]]["id"], "contest": W1X},
      focus="mark", says=[fmt_mark(W1X, ranked(W1X)[0]["mark"])], tags=["follow_up", "pronoun"]),
    T("and by how much did she win", "competitor_margin",
      {"competitor": ranked(W1X)[0]["competitor"], "contest": W1X}, focus="margin",
      says=[winner_margin(W1X)], tags=["follow_up", "pronoun"]),
    T("where was it rowed", "contest_time", {"contest": W1X}, focus="where",
      says=[CON[W1X]["venue"]], tags=["follow_up"]),
    U("how many boats from orrindel have raced on the lake", focus="count",
      tags=["constraint", "cross_contest"]),
))

add(CONV(["onov"],
    T("onov sarromell results", "competitor_profile", {"competitor": SARROMELL}, focus="profile",
      says=disciplines_of(SARROMELL), tags=["terse"]),
    T("how many medals", "competitor_medals", {"competitor": SARROMELL}, focus="count",
      says=[count_word(medals_of(SARROMELL))], tags=["follow_up", "ellipsis"]),
    T("where's he from", "competitor_delegation", {"competitor": SARROMELL}, focus="group_of",
      says=[G(group_of(SARROMELL))], tags=["follow_up", "contraction"]),
    T("and how many golds does that delegation have", "delegation_medals",
      {"group": group_of(SARROMELL), "award": "gold"}, focus="count",
      says=[count_word(group_count(group_of(SARROMELL), award="gold"))], tags=["follow_up"]),
))

add(CONV(["1500", "dulvaire"],
    T("did cenna dulvaire get a medal", "competitor_medals", {"competitor": DULVAIRE}, focus="whether",
      says=awards_of(DULVAIRE), tags=["diacritics"]),
    T("in which race", "competitor_profile", {"competitor": DULVAIRE}, focus="profile",
      says=disciplines_of(DULVAIRE), tags=["follow_up"]),
    T("how far behind the winner was she", "competitor_margin", {"competitor": DULVAIRE, "contest": W1500},
      focus="margin", says=[fmt_gap(W1500, entry_of(DULVAIRE, W1500)["mark"], ranked(W1500)[0]["mark"]),
                            at_place(W1500, 1)[0]],
      tags=["follow_up", "pronoun"]),
    U("is that a personal best for her", focus="other", tags=["follow_up", "pronoun"]),
))

add(CONV(["delegation", "rank", "alias"],
    T("how are team vastrelia doing on the medal table", "delegation_medals", {"group": "vastrelia"},
      focus="rank", says=[group_rank("vastrelia")], tags=["alias"]),
    T("how many silvers", "delegation_medals", {"group": "vastrelia", "award": "silver"}, focus="count",
      says=[count_word(group_count("vastrelia", award="silver"))], tags=["follow_up", "ellipsis"]),
    T("who has the most silvers", "most_medals", {"award": "silver"}, focus="who",
      says=gnames(most(award="silver")[0]), tags=["tie"]),
    T("and how did vastrelia do in the men's 400", "delegation_in_event", {"group": "vastrelia", "contest": M400},
      focus="how_did", says=[pname(ent_in_group("vastrelia", M400)["competitor"])], tags=["return"]),
))

add(CONV(["zandrel"],
    T("how did zandrel do in the men's 100 breaststroke", "delegation_in_event",
      {"group": "zandrel", "contest": M100BR}, focus="how_did",
      says=[pname(ent_in_group("zandrel", M100BR)["competitor"])], tags=["alias"]),
    T("whats their medal count", "delegation_medals", {"group": "zandrel"}, focus="count",
      says=[count_word(group_count("zandrel"))], tags=["follow_up", "pronoun"]),
    U("how many medals did zandrel win at the last games", focus="count", tags=["follow_up"]),
    T("ok which place are they in now", "delegation_medals", {"group": "zandrel"}, focus="rank",
      says=[group_rank("zandrel")], tags=["follow_up"]),
))

add(CONV(["rentenert"],
    T("what sport is rasaline rentenert", "competitor_sport", {"competitor": RENTENERT}, focus="sport_of",
      says=[PER[RENTENERT]["sport"], disciplines_of(RENTENERT)[0]]),
    T("did she win", "competitor_result", {"competitor": RENTENERT, "contest": W400}, focus="whether",
      says=[ordinal(entry_of(RENTENERT, W400)["place"])], tags=["follow_up", "pronoun"]),
    T("by what margin tho", "competitor_margin", {"competitor": RENTENERT, "contest": W400}, focus="margin",
      says=[winner_margin(W400), at_place(W400, 2)[0]], tags=["follow_up", "ellipsis"]),
    T("who finished last", "contest_place", {"contest": W400, "place": str(last_place(W400))}, focus="who",
      says=at_place(W400, last_place(W400)), tags=["follow_up"]),
))

add(CONV(["misc_uncovered"],
    U("what's the weather like at merrin lake", focus="other"),
    U("who is the head coach of the kalvenmark athletics team", focus="who"),
    T("whatever. how many golds has kalvenmark got", "delegation_medals", {"group": "kalvenmark", "award": "gold"},
      focus="count", says=[count_word(group_count("kalvenmark", award="gold"))], tags=["chatty"]),
    U("how much prize money do they get for that", focus="other", tags=["follow_up"]),
))

add(CONV(["cusolick", "dnf"],
    T("where did cidys cusolick finish in the marathon", "competitor_result",
      {"competitor": CUSOLICK, "contest": WMAR}, focus="how_did", never=[ordinal(len(CON[WMAR]["entries"]))]),
    T("who won that race", "podium", {"contest": WMAR}, says=[at_place(WMAR, 1)[0]],
      tags=["follow_up", "pronoun"]),
    T("and who got bronze", "medalist", {"contest": WMAR, "award": "bronze"},
      says=with_award(WMAR, "bronze"), tags=["follow_up", "ellipsis"]),
    U("what was the temperature during it", tags=["follow_up", "pronoun"]),
))
assert entry_of(CUSOLICK, WMAR).get("status") == "dnf"

# ----------------------------------------------------------- single questions
add(T("what can you do", "help", focus="chat"))
add(NU("asdkjh qwe zzz", tags=["gibberish"]))
add(NU("whats the capital of portugal"))
add(T("who won the womens pole vault", "podium", {}, outcome="no_data",
      never=[at_place(WLJ, 1)[0]], tags=["uncovered"]))
add(T("results of the men's 100m semi final", "full_results", {}, outcome="no_data", focus="results",
      never=[fmt_mark(M100, ranked(M100)[0]["mark"])], tags=["uncovered", "constraint"]))
add(T("top 3 in the mens road race", "full_results", {"contest": MRR, "count": "3"}, focus="results",
      says=[entrant(e) for e in ranked(MRR, 3)], never=[entrant(ranked(MRR)[3])], tags=["number_words"]))
add(T("where did the men's road race take place", "contest_time", {"contest": MRR}, focus="where",
      outcome="no_data", never=[CON[MTT]["venue"]], tags=["uncovered"]))
assert "venue" not in CON[MRR]
add(U("how many delegations are taking part", focus="count"))
add(U("who is carrying the flag for vastrelia", focus="who"))
add(T("who's in front in the womens 100 final", "live_leader", {"contest": W100}, outcome="no_data",
      never=at_place(W100H1, 1) + at_place(W100H2, 1), tags=["contraction"]))
add(T("who won the mens marathon", "podium", {"contest": MMAR}, outcome="no_data"))
add(T("who was fifth in the women's marathon", "contest_place", {"contest": WMAR, "place": "5"},
      focus="who", says=at_place(WMAR, 5), tags=["number_words"]))
add(T("men's sprint final podium", "podium", {"contest": M100}, says=podium_names(M100),
      tags=["alias", "terse"]))
add(T("what country is lorov lassoss from", "competitor_delegation", {"competitor": LASSOSS},
      focus="group_of", says=[G(group_of(LASSOSS))]))
add(T("gumarace heat time", "competitor_result", {"competitor": GUMARACE, "contest": W100H2},
      focus="mark", says=[fmt_mark(W100H2, entry_of(GUMARACE, W100H2)["mark"])], tags=["terse", "partial"]))
add(U("which gold medallists so far are from brellmoor", focus="who", tags=["cross_contest"]))
add(U("how many medals has halvorne won at tidewell aquatic centre", focus="count",
      never=[count_word(group_count("halvorne"))], tags=["constraint"]))
add(T("did zovic sondille medal on the floor", "competitor_result", {"competitor": SONDILLE, "contest": MFL},
      focus="whether", says=[ordinal(entry_of(SONDILLE, MFL)["place"])]))
add(U("which venue has hosted the most events", focus="where", tags=["cross_contest"]))
add(T("when did the mens 1500 final happen", "contest_time", {"contest": M1500}, focus="when",
      says=[hhmm(M1500)]))
add(T("who won bronze in the men's 400", "medalist", {"contest": M400, "award": "bronze"},
      says=with_award(M400, "bronze")))
add(T("did fuswick beat brelkeroy in the 1500", "head_to_head",
      {"competitor": FUSWICK, "rival": pid("Brelkeroy"), "contest": M1500}, focus="whether",
      says=[ahead(FUSWICK, pid("Brelkeroy"), M1500)], tags=["partial"]))
add(T("how many medals has krosago got", "competitor_medals", {"competitor": KROSAGO}, focus="count",
      says=[count_word(medals_of(KROSAGO))], tags=["partial"]))
add(U("is the womens 100 final going to be delayed", focus="when"))
add(T("orrindel islanders medal tally", "delegation_medals", {"group": "orrindel"}, focus="count",
      says=[count_word(group_count("orrindel"))], tags=["alias", "terse"]))
add(T("who came 2nd in the javelin men so far", "contest_place", {"contest": MJAV, "place": "2"},
      focus="who", says=at_place(MJAV, 2), tags=["live"]))
add(T("what's mirvessi's best throw tonight", "competitor_result", {"competitor": MIRVESSI, "contest": MJAV},
      focus="mark", says=[fmt_mark(MJAV, entry_of(MIRVESSI, MJAV)["mark"])], tags=["partial"]))
add(U("list every athlete from aubrecy", focus="other"))
add(U("which medal events are still to be decided", focus="open", tags=["cross_contest"]))
add(U("whats left to decide in the pool", focus="open", tags=["constraint", "cross_contest"]))
add(T("hi", "greeting", focus="chat", tags=["terse"]))
add(U("has anyone failed a drugs test", focus="whether"))


# ----------------------------------------------------------- checks & output
KNOWN_INTENTS = {
    "best_mark", "competitor_delegation", "competitor_margin", "competitor_medals", "competitor_next",
    "competitor_profile", "competitor_result", "competitor_sport", "contest_place", "contest_time",
    "delegation_in_event", "delegation_medals", "full_results", "greeting", "head_to_head", "help",
    "live_leader", "medal_table_leader", "medal_table_top", "medalist", "most_medals", "podium",
    "schedule_day", "thanks", "under_way", "none"}
FOCUS = {"who", "how_did", "results", "count", "rank", "table", "margin", "mark", "when", "where",
         "schedule", "status", "whether", "compare", "group_of", "sport_of", "profile", "open", "chat", "other"}
OUTCOMES = {"answered", "clarify", "no_data", "not_covered", "not_understood"}


def turns():
    for case in CASES:
        if "conversation" in case:
            assert 2 <= len(case["conversation"]) <= 6, case["conversation"][0]["ask"]
            yield from case["conversation"]
        else:
            yield case


def validate():
    asks = set()
    for t in turns():
        assert t["intent"] in KNOWN_INTENTS, t
        assert t["focus"] in FOCUS, t
        assert t["outcome"] in OUTCOMES, t
        assert t["ask"] not in asks, ("duplicate ask", t["ask"])
        asks.add(t["ask"])
        for k, v in t.get("slots", {}).items():
            if k in ("competitor", "rival"):
                assert v in PER, t
            elif k == "contest":
                assert v in CON, t
            elif k == "group":
                assert v in GRP, t
            elif k == "sport":
                assert v in SPO, t
        for s in t.get("says", []):
            assert s and s != "None", t
        if t["outcome"] == "answered" and t["intent"] not in ("greeting", "thanks", "help"):
            pass


def main():
    validate()
    all_turns = list(turns())
    n = len(all_turns)
    unc = sum(1 for t in all_turns if t["outcome"] == "not_covered")
    nd = sum(1 for t in all_turns if t["outcome"] == "no_data")
    nu = sum(1 for t in all_turns if t["outcome"] == "not_understood")
    header = (
        "# Blind question set: scenario games, round 6\n"
        "# Moment: Saturday 2027-08-14 21:10 Europe/Lisbon (+01:00); data as of 21:04\n"
        "#   today = 2027-08-14, tomorrow = 2027-08-15, yesterday = 2027-08-13\n"
        "# Written by tests/eval/blind/round6/label_games.py from dataset-demo/games/*.json\n"
        f"# Cases: {len(CASES)}; turns: {n}; not_covered: {unc}; no_data: {nd}; not_understood: {nu}\n"
    )
    with open(OUT, "w", encoding="utf-8") as fh:
        fh.write(header)
        yaml.safe_dump(CASES, fh, allow_unicode=True, sort_keys=False, width=120)
    print(f"cases={len(CASES)} conversations={sum(1 for c in CASES if 'conversation' in c)} "
          f"turns={n} not_covered={unc} ({100*unc/n:.1f}%) no_data={nd} not_understood={nu} "
          f"uncovered_total={(unc+nd+nu)} ({100*(unc+nd+nu)/n:.1f}%)")


if __name__ == "__main__":
    main()
