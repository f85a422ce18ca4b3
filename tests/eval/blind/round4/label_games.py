#!/usr/bin/env python3
"""Blind question set for the games scenario, labelled from the data.

Moment: Saturday 14 August 2027, 21:10 (+01:00); data as of 21:04.
Every expected fact is computed here from dataset-demo/games/*.json.
Writes games.yaml next to this script.
"""
import collections
import json
import os
from decimal import Decimal

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "games"))


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


COMP = {p["id"]: p for p in load("competitors.json")}
CONTESTS = load("contests.json")
CON = {c["id"]: c for c in CONTESTS}
GROUPS = {g["id"]: g for g in load("groups.json")}
SPORTS = {s["id"]: s for s in load("sports.json")}
SCEN = load("scenario.json")
CLOCK = SCEN["clock"][:16]  # 2027-08-14T21:10
TODAY, TOMORROW, YESTERDAY = "2027-08-14", "2027-08-15", "2027-08-13"
AWARDS = ["gold", "silver", "bronze"]
WORDS = ["no", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


# ---------------------------------------------------------------- facts
def N(pid):
    p = COMP[pid]
    return f"{p['given']} {p['family']}"


def GN(gid):
    return GROUPS[gid]["name"]


def count_word(n):
    return WORDS[n] if n < 10 else str(n)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def entry_name(e):
    return N(e["competitor"]) if "competitor" in e else GN(e["group"])


def entry_group(e):
    return e["group"] if "group" in e else COMP[e["competitor"]]["group"]


def placed(cid):
    es = [e for e in CON[cid].get("entries", []) if e.get("place") is not None]
    return sorted(es, key=lambda e: e["place"])


def fmt_mark(cid, mark):
    m = CON[cid]["measure"]
    if m == "time":
        return mark if ":" in mark else f"{mark} s"
    if m == "distance":
        return f"{mark} m"
    return mark


def secs(mark):
    parts = mark.split(":")
    total = Decimal(0)
    for p in parts:
        total = total * 60 + Decimal(p)
    return total


def fmt_gap(cid, a, b):
    m = CON[cid]["measure"]
    if m == "time":
        d = abs(secs(a) - secs(b))
        if d < 60:
            return f"{d} s"
        mins = int(d // 60)
        return f"{mins}:{d - mins * 60:05}"
    d = abs(Decimal(a) - Decimal(b))
    if m == "distance":
        return f"{d} m"
    return str(d.normalize())


def at_place(cid, n):
    return [entry_name(e) for e in placed(cid) if e["place"] == n]


def last_place(cid):
    return max(e["place"] for e in placed(cid))


def medal_names(cid, award):
    return [entry_name(e) for e in CON[cid].get("entries", []) if e.get("award") == award]


def podium(cid):
    return [entry_name(e) for e in CON[cid]["entries"] if e.get("award")]


def winner(cid):
    return at_place(cid, 1)[0]


def mark_of(cid, n):
    return fmt_mark(cid, [e for e in placed(cid) if e["place"] == n][0]["mark"])


def entry_of(pid, cid):
    for e in CON[cid].get("entries", []):
        if e.get("competitor") == pid or pid in e.get("members", []):
            return e
    raise KeyError((pid, cid))


def result_says(pid, cid):
    e = entry_of(pid, cid)
    if e.get("status"):
        return []
    out = [fmt_mark(cid, e["mark"])]
    out.append(e["award"] if e.get("award") else ordinal(e["place"]))
    return out


def margin_says(pid, cid):
    """Gap to the next one when the athlete won, otherwise to the winner, and the winner."""
    e = entry_of(pid, cid)
    es = placed(cid)
    if e["place"] == 1:
        other = es[1]
        return [fmt_gap(cid, e["mark"], other["mark"])]
    first = es[0]
    return [entry_name(first), fmt_gap(cid, e["mark"], first["mark"])]


def contests_of(pid):
    return [c["id"] for c in CONTESTS
            if any(e.get("competitor") == pid or pid in e.get("members", []) for e in c.get("entries", []))]


def medals_of(pid, award=None):
    out = []
    for cid in contests_of(pid):
        e = entry_of(pid, cid)
        if e.get("award") and (award is None or e["award"] == award):
            out.append((cid, e["award"]))
    return out


def next_of(pid):
    ups = [cid for cid in contests_of(pid) if CON[cid]["status"] == "scheduled"]
    ups.sort(key=lambda c: CON[c]["start"])
    return ups[0] if ups else None


def hhmm(cid):
    return CON[cid]["start"][11:16]


def day_of(cid):
    return CON[cid]["start"][:10]


def medal_table(sport=None, date=None):
    t = collections.defaultdict(lambda: [0, 0, 0])
    for c in CONTESTS:
        if sport and c["sport"] != sport:
            continue
        if date and day_of(c["id"]) != date:
            continue
        for e in c.get("entries", []):
            if e.get("award"):
                t[entry_group(e)][AWARDS.index(e["award"])] += 1
    return dict(t)


def ordered(table, award=None):
    if award:
        k = AWARDS.index(award)
        return sorted(table.items(), key=lambda x: (-x[1][k], GN(x[0])))
    return sorted(table.items(), key=lambda x: (-x[1][0], -x[1][1], -x[1][2], GN(x[0])))


def leaders(sport=None, date=None, award=None):
    rows = ordered(medal_table(sport, date), award)
    if not rows:
        return []
    key = (lambda v: v[AWARDS.index(award)]) if award else (lambda v: tuple(v))
    top = key(rows[0][1])
    return [GN(g) for g, v in rows if key(v) == top]


def most_medals(sport=None, date=None):
    t = medal_table(sport, date)
    best = max(sum(v) for v in t.values())
    return [GN(g) for g, v in t.items() if sum(v) == best], best


def top_n(n, sport=None, date=None):
    rows = ordered(medal_table(sport, date))
    return [GN(g) for g, _ in rows[:n]]


def rank_of(gid, sport=None, date=None):
    rows = ordered(medal_table(sport, date))
    v = dict(rows)[gid]
    better = sum(1 for _, w in rows if tuple(w) > tuple(v))
    return ordinal(better + 1)


def group_count(gid, award=None, sport=None, date=None):
    v = medal_table(sport, date).get(gid, [0, 0, 0])
    return v[AWARDS.index(award)] if award else sum(v)


def on_day(date, sport=None):
    out = [c["id"] for c in CONTESTS if day_of(c["id"]) == date and (sport is None or c["sport"] == sport)]
    return sorted(out, key=lambda c: CON[c]["start"])


def live(sport=None):
    return [c["id"] for c in CONTESTS if c["status"] == "live" and (sport is None or c["sport"] == sport)]


def leader_says(cid):
    es = placed(cid)
    return [entry_name(es[0]), fmt_mark(cid, es[0]["mark"])]


def lead_gap(cid):
    es = placed(cid)
    return fmt_gap(cid, es[0]["mark"], es[1]["mark"])


def best_mark(sport, disc, category):
    marks = []
    for c in CONTESTS:
        if c["sport"] == sport and c["discipline"] == disc and c["category"] == category and c["status"] == "final":
            for e in placed(c["id"]):
                marks.append((c["id"], e))
    if not marks:
        return None
    low = CON[marks[0][0]]["measure"] == "time"
    keyf = (lambda x: secs(x[1]["mark"])) if low else (lambda x: Decimal(x[1]["mark"]))
    best = min(marks, key=keyf) if low else max(marks, key=keyf)
    names = [entry_name(e) for cid, e in marks if keyf((cid, e)) == keyf(best)]
    return fmt_mark(best[0], best[1]["mark"]), names


def ahead(pid, rid, cid):
    a, b = entry_of(pid, cid), entry_of(rid, cid)
    pa = a.get("place") or 999
    pb = b.get("place") or 999
    return N(pid) if pa < pb else N(rid)


def disc_name(cid):
    c = CON[cid]
    for d in SPORTS[c["sport"]]["disciplines"]:
        if d["id"] == c["discipline"]:
            return d["name"]
    raise KeyError(cid)


def events_of(pid):
    out = []
    for cid in contests_of(pid):
        n = disc_name(cid)
        if n not in out:
            out.append(n)
    return out


def sport_name(pid):
    return SPORTS[COMP[pid]["sport"]]["name"]


# ---------------------------------------------------------------- builders
def T(ask, intent, slots=None, outcome="answered", focus=None, says=(), never=(), tags=()):
    d = {"ask": ask, "intent": intent}
    if intent != "none":
        d["slots"] = slots if slots is not None else {}
    d["outcome"] = outcome
    if focus:
        d["focus"] = focus
    if says:
        d["says"] = list(says)
    if never:
        d["never"] = list(never)
    if tags:
        d["tags"] = list(tags)
    return d


def U(ask, focus="other", never=(), tags=(), outcome="not_covered"):
    """A question no intent answers."""
    return T(ask, "none", outcome=outcome, focus=focus, never=never, tags=["uncovered"] + list(tags))


def NOEVENT(ask, intent, focus, slots=None, never=(), tags=()):
    """Covered question about an event the data does not have."""
    d = {"ask": ask, "intent": intent}
    if slots:
        d["slots"] = slots
    d["outcome"] = "no_data"
    d["focus"] = focus
    if never:
        d["never"] = list(never)
    d["tags"] = ["uncovered"] + list(tags)
    return d


def CONV(*turns, tags=()):
    return {"conversation": list(turns), "tags": list(tags)}


cases = []
add = cases.append

# shorthand ids
M100, M100H1, M100H2 = "ath-m-100m-final", "ath-m-100m-heat-1", "ath-m-100m-heat-2"
W100, W100H1, W100H2 = "ath-w-100m-final", "ath-w-100m-heat-1", "ath-w-100m-heat-2"
M200, W200, M400, W400 = "ath-m-200m-final", "ath-w-200m-final", "ath-m-400m-final", "ath-w-400m-final"
M1500, W1500 = "ath-m-1500m-final", "ath-w-1500m-final"
MLJ, WLJ = "ath-m-long-jump-final", "ath-w-long-jump-final"
WMAR, MMAR = "ath-w-marathon-final", "ath-m-marathon-final"
MHJ, WHJ = "ath-m-high-jump-final", "ath-w-high-jump-final"
MJAV, WJAV = "ath-m-javelin-final", "ath-w-javelin-final"
SW100F, SM100F = "swm-w-100m-freestyle-final", "swm-m-100m-freestyle-final"
SW200F, SM200F = "swm-w-200m-freestyle-final", "swm-m-200m-freestyle-final"
SW200FLY, SM200FLY = "swm-w-200m-butterfly-final", "swm-m-200m-butterfly-final"
SW100BR, SM100BR = "swm-w-100m-breaststroke-final", "swm-m-100m-breaststroke-final"
SW400IM, SM400IM = "swm-w-400m-individual-medley-final", "swm-m-400m-individual-medley-final"
RW1X, RM1X, RM2X, RW2X = ("row-w-single-sculls-final", "row-m-single-sculls-final",
                          "row-m-double-sculls-final", "row-w-double-sculls-final")
CMRR, CWRR, CWTT, CMTT = ("cyc-m-road-race-final", "cyc-w-road-race-final",
                          "cyc-w-time-trial-final", "cyc-m-time-trial-final")
GMAA, GWAA, GWFL, GMFL, GWVT, GMVT = ("gym-m-all-around-final", "gym-w-all-around-final",
                                      "gym-w-floor-final", "gym-m-floor-final",
                                      "gym-w-vault-final", "gym-m-vault-final")
BM, BW = "bkb-m-tournament-final", "bkb-w-tournament-final"

assert CON[W100]["status"] == "scheduled" and CON[MJAV]["status"] == "live"
assert set(live()) == {MMAR, MHJ, MJAV, GWAA}

# ================================================================ single questions
# --- podium / medalist
add(T("winner of the mens 100m final?", "podium", {"contest": M100}, focus="who",
      says=[winner(M100)], tags=["terse"]))
add(T("who took the medals in the womens 1500", "podium", {"contest": W1500}, focus="results",
      says=podium(W1500), tags=["contraction"]))
add(T("podium for the men's 200 metres pls", "podium", {"contest": M200}, focus="results",
      says=podium(M200), never=at_place(M200, 4), tags=["chatty"]))
add(T("who got silver in the women's 200 free?", "medalist", {"contest": SW200F, "award": "silver"}, focus="who",
      says=medal_names(SW200F, "silver"), never=at_place(SW200F, 4), tags=["tie"]))
add(T("bronze in the mens long jump - who?", "medalist", {"contest": MLJ, "award": "bronze"}, focus="who",
      says=medal_names(MLJ, "bronze"), never=medal_names(MLJ, "gold") + medal_names(MLJ, "silver"),
      tags=["partial"]))
add(T("who won gold in the women's single sculls", "medalist", {"contest": RW1X, "award": "gold"}, focus="who",
      says=medal_names(RW1X, "gold"), never=medal_names(RW1X, "silver"), tags=["exact"]))
add(T("who won the mens double sculls", "podium", {"contest": RM2X}, focus="who",
      says=[winner(RM2X)], tags=["exact"]))
add(T("road race women winner??", "podium", {"contest": CWRR}, focus="who",
      says=[winner(CWRR)], tags=["terse"]))
add(T("who won the metric mile for the men", "podium", {"contest": M1500}, focus="who",
      says=[winner(M1500)], tags=["alias"]))
add(T("whos the womens marathon champion", "podium", {"contest": WMAR}, focus="who",
      says=[winner(WMAR)], tags=["contraction"]))
add(T("who won the mens floor in gymnastics?", "podium", {"contest": GMFL}, focus="who",
      says=[winner(GMFL)], never=at_place(GMFL, 2), tags=["exact"]))
add(T("who grabbed silver in the 400 IM for women", "medalist", {"contest": SW400IM, "award": "silver"},
      outcome="no_data", focus="who", tags=["uncovered", "not_yet"]))
add(T("who won the men's javelin", "podium", {"contest": MJAV}, outcome="no_data", focus="who",
      tags=["uncovered", "live"]))
add(T("women's all-around gold medallist?", "medalist", {"contest": GWAA, "award": "gold"},
      outcome="no_data", focus="who", tags=["uncovered", "live"]))
add(NOEVENT("who won the men's pole vault", "podium", "who", never=leader_says(MHJ)[:1],
            tags=["no_event"]))
add(NOEVENT("who won the 10,000m for women?", "podium", "who", never=[winner(W1500), winner(WMAR)],
            tags=["no_event"]))
add(NOEVENT("who won the mens 100 backstroke", "podium", "who", never=[winner(SM100F)],
            tags=["no_event"]))
add(T("who won the men's time trial?", "podium", {"contest": CMTT}, outcome="no_data", focus="who",
      never=[winner(CWTT)], tags=["uncovered", "not_yet"]))
add(T("who won the men's sprint final", "podium", {"contest": M100}, focus="who",
      says=[winner(M100)], tags=["alias"]))

# --- contest_place / full results
add(T("who finished fourth in the men's 100 metres", "contest_place", {"contest": M100, "place": "4"},
      focus="who", says=at_place(M100, 4), never=medal_names(M100, "bronze"), tags=["number_words"]))
add(T("who came last in the men's 1500?", "contest_place",
      {"contest": M1500, "place": str(last_place(M1500))}, focus="who",
      says=at_place(M1500, last_place(M1500)), tags=["last"]))
add(T("whos 5th in the men's all around", "contest_place", {"contest": GMAA, "place": "5"}, focus="who",
      says=at_place(GMAA, 5), tags=["contraction"]))
add(T("who won heat 2 of the men's 100", "contest_place", {"contest": M100H2, "place": "1"}, focus="who",
      says=at_place(M100H2, 1), never=[winner(M100)], tags=["constraint"]))
add(T("full results women's long jump", "full_results", {"contest": WLJ}, focus="results",
      says=[entry_name(e) for e in placed(WLJ)], tags=["exact"]))
add(T("can I see the top 5 of the men's road race", "full_results", {"contest": CMRR, "count": "5"},
      focus="results", says=[entry_name(e) for e in placed(CMRR)[:5]],
      never=[entry_name(e) for e in placed(CMRR)[5:]], tags=["constraint"]))
add(T("results mens 100 breaststroke", "full_results", {"contest": SM100BR}, focus="results",
      says=[entry_name(e) for e in placed(SM100BR)], tags=["terse"]))
add(T("full standings for the men's 400 IM?", "full_results", {"contest": SM400IM}, outcome="no_data",
      focus="results", tags=["uncovered", "not_yet"]))
add(T("results of the women's double sculls", "full_results", {"contest": RW2X}, outcome="no_data",
      focus="results", tags=["uncovered", "not_yet"]))
add(NOEVENT("results for the women's triple jump please", "full_results", "results",
            never=[winner(WLJ)], tags=["no_event"]))

# --- competitor results / margin / head to head
add(T("how did Bana Gulelick do in the 200?", "competitor_result", {"competitor": "p131", "contest": W200},
      focus="how_did", says=result_says("p131", W200), tags=["exact"]))
add(T("Rhea Maud OCarrowin long jump result", "competitor_result", {"competitor": "p159", "contest": WLJ},
      focus="how_did", says=result_says("p159", WLJ), tags=["misspelling", "terse"]))
add(T("how'd Jory get on in the breaststroke", "competitor_result", {"competitor": "p069", "contest": SM100BR},
      focus="how_did", says=[ordinal(entry_of("p069", SM100BR)["place"])], tags=["alias", "contraction"]))
add(T("what time did the quay rocket run in the 200", "competitor_result", {"competitor": "p005", "contest": M200},
      focus="mark", says=[fmt_mark(M200, entry_of("p005", M200)["mark"])], tags=["alias"]))
add(T("how far did Sondora Hervoveth jump?", "competitor_result", {"competitor": "p166", "contest": WLJ},
      focus="mark", says=[fmt_mark(WLJ, entry_of("p166", WLJ)["mark"])], tags=["exact"]))
add(T("how much did Tetha Brelwick win the time trial by", "competitor_margin",
      {"competitor": "p210", "contest": CWTT}, focus="margin", says=margin_says("p210", CWTT), tags=["exact"]))
add(T("by how much did Tuthette Brossayne miss out on gold", "competitor_margin",
      {"competitor": "p161", "contest": WLJ}, focus="margin", says=margin_says("p161", WLJ), tags=["partial"]))
add(T("thindust zavindal winning margin single sculls", "competitor_margin",
      {"competitor": "p088", "contest": RM1X}, focus="margin", says=margin_says("p088", RM1X), tags=["terse"]))
add(T("who beat Modys Missorn in the 200m and by how much?", "competitor_margin",
      {"competitor": "p130", "contest": W200}, focus="margin", says=margin_says("p130", W200), tags=["exact"]))
add(T("did Zorvren finish ahead of Dosavorn in the 100 final?", "head_to_head",
      {"competitor": "p002", "rival": "p001", "contest": M100}, focus="compare",
      says=[ahead("p002", "p001", M100)], tags=["partial"]))
add(T("Hanel Zilkedorn or Zovic Sondille, who was higher on floor", "head_to_head",
      {"competitor": "p114", "rival": "p115", "contest": GMFL}, focus="compare",
      says=[ahead("p114", "p115", GMFL)], tags=["exact"]))
add(T("was onov sarromell faster than issov fustisessi in the 200 free", "head_to_head",
      {"competitor": "p079", "rival": "p082", "contest": SM200F}, focus="compare",
      says=[ahead("p079", "p082", SM200F)], tags=["exact"]))

# --- athlete info
add(T("which delegation is Lomov Kerreth with", "competitor_delegation", {"competitor": "p053"}, focus="group_of",
      says=[GN(COMP["p053"]["group"])], tags=["exact"]))
add(T("what country does Lucja Wenderow throw for", "competitor_delegation", {"competitor": "p175"},
      focus="group_of", says=[GN(COMP["p175"]["group"])], tags=["diacritics"]))
add(T("who does Emeric Tollevant represent?", "competitor_delegation", {"competitor": "p007"}, focus="group_of",
      says=[GN(COMP["p007"]["group"])], tags=["diacritics"]))
add(T("what sport is Søvi Arkenlund in", "competitor_sport", {"competitor": "p243"}, focus="sport_of",
      says=[sport_name("p243")], tags=["exact"]))
add(T("Big Tobi plays what?", "competitor_sport", {"competitor": "p253"}, focus="sport_of",
      says=[sport_name("p253")], tags=["alias"]))
add(T("what events is Mårten Quellby doing", "competitor_sport", {"competitor": "p104"}, focus="sport_of",
      says=[sport_name("p104")] + events_of("p104"), tags=["exact"]))
add(T("how many medals has Hothic Nuvasko got", "competitor_medals", {"competitor": "p072"}, focus="count",
      says=[count_word(len(medals_of("p072")))], tags=["exact"]))
add(T("how many golds for tetha brelwick", "competitor_medals", {"competitor": "p210", "award": "gold"},
      focus="count", says=[count_word(len(medals_of("p210", "gold")))], tags=["constraint"]))
add(T("does Merrel Vareroy have a medal?", "competitor_medals", {"competitor": "p239"}, focus="whether",
      says=[medals_of("p239")[0][1]], tags=["team_member"]))
add(T("has Renee Ostravin won any gold", "competitor_medals", {"competitor": "p207", "award": "gold"},
      focus="whether", tags=["diacritics"]))
add(T("Tell me about Hanel Zilkedorn's games so far", "competitor_profile", {"competitor": "p114"},
      focus="profile", says=[fmt_mark(c, entry_of("p114", c)["mark"]) for c in contests_of("p114")],
      tags=["exact"]))
add(T("give me Issov Fustisessi's results", "competitor_profile", {"competitor": "p082"}, focus="profile",
      says=[fmt_mark(c, entry_of("p082", c)["mark"]) for c in contests_of("p082")], tags=["exact"]))
add(T("when does Krundena Dovonasko compete next?", "competitor_next", {"competitor": "p230"}, focus="when",
      says=[hhmm(next_of("p230"))], tags=["exact"]))
add(T("next race for Thumard Zevert?", "competitor_next", {"competitor": "p101"}, focus="when",
      says=[hhmm(next_of("p101"))], tags=["terse"]))
assert next_of("p005") is None
add(T("when is galkace running again", "competitor_next", {"competitor": "p005"}, outcome="no_data",
      focus="when", tags=["uncovered", "nothing_left"]))

# --- delegations
add(T("how many medals does Kalvenmark have", "delegation_medals", {"group": "kalvenmark"}, focus="count",
      says=[count_word(group_count("kalvenmark"))], tags=["exact"]))
add(T("Orrindel golds?", "delegation_medals", {"group": "orrindel", "award": "gold"}, focus="count",
      says=[count_word(group_count("orrindel", "gold"))], tags=["alias", "terse"]))
add(T("where are Halvorne in the medal table", "delegation_medals", {"group": "halvorne"}, focus="rank",
      says=[rank_of("halvorne")], tags=["exact"]))
add(T("how many medals has Dunmerrow won in cycling", "delegation_medals", {"group": "dunmerrow", "sport": "cycling"},
      focus="count", says=[count_word(group_count("dunmerrow", sport="cycling"))], tags=["constraint"]))
add(T("did Zandrel win anything today", "delegation_medals", {"group": "zandrel", "date": TODAY}, focus="whether",
      says=[count_word(group_count("zandrel", date=TODAY))], tags=["relative_day", "constraint"]))
add(T("has welkmarsh won a medal yet", "delegation_medals", {"group": "welkmarsh"}, focus="whether",
      tags=["exact", "zero"]))
add(T("how did Brellmoor do in the men's floor", "delegation_in_event", {"group": "brellmoor", "contest": GMFL},
      focus="how_did", says=[N("p114"), entry_of("p114", GMFL)["award"]], tags=["exact"]))
add(T("how did the Sordavia team get on in the womens javelin", "delegation_in_event",
      {"group": "sordavia", "contest": WJAV}, focus="how_did", says=[N("p182")], tags=["alias"]))
add(T("how will Kalvenmark do in the women's 100 final", "delegation_in_event",
      {"group": "kalvenmark", "contest": W100}, outcome="no_data", focus="how_did", tags=["uncovered", "not_yet"]))

# --- medal table
add(T("who's top of the medal table", "medal_table_leader", {}, focus="who", says=leaders(),
      never=[n for n in top_n(3)[1:]] if len(leaders()) == 1 else [], tags=["contraction"]))
add(T("show me the top five in the medal standings", "medal_table_top", {"count": "5"}, focus="table",
      says=top_n(5), never=top_n(6)[5:], tags=["number_words"]))
add(T("who leads the swimming medal count", "medal_table_leader", {"sport": "swimming"}, focus="who",
      says=leaders("swimming"), tags=["constraint"]))
add(T("top of the table in rowing", "medal_table_top", {"sport": "rowing"}, focus="table",
      says=top_n(1, "rowing"), tags=["constraint"]))
add(T("which delegation has the most golds", "most_medals", {"award": "gold"}, focus="who",
      says=leaders(award="gold"), tags=["constraint"]))
add(T("who has the most medals overall?", "most_medals", {}, focus="who", says=most_medals()[0], tags=["tie"]))
add(T("who won the most medals in athletics", "most_medals", {"sport": "athletics"}, focus="who",
      says=most_medals("athletics")[0], tags=["constraint"]))
add(T("who did best on the medal table on friday", "medal_table_leader", {"date": YESTERDAY}, focus="who",
      says=leaders(date=YESTERDAY), tags=["constraint", "relative_day"]))
assert not medal_table(date=TOMORROW)
add(T("who'll top tomorrow's medal table", "medal_table_leader", {"date": TOMORROW}, outcome="no_data",
      focus="who", tags=["uncovered", "relative_day"]))

# --- schedule, live, times
add(T("what's on today?", "schedule_day", {"date": TODAY}, focus="schedule",
      says=[hhmm(c) for c in on_day(TODAY)], tags=["relative_day"]))
add(T("what's happening on monday", "schedule_day", {"date": "2027-08-16"}, focus="schedule",
      says=[hhmm(c) for c in on_day("2027-08-16")], tags=["relative_day"]))
add(T("cycling schedule for the 17th", "schedule_day", {"date": "2027-08-17", "sport": "cycling"},
      focus="schedule", says=[hhmm(c) for c in on_day("2027-08-17", "cycling")],
      never=[hhmm(c) for c in on_day("2027-08-17") if CON[c]["sport"] != "cycling"], tags=["constraint"]))
add(T("what's live right now", "under_way", {}, focus="schedule",
      says=[disc_name(c) for c in live()], tags=["now"]))
add(T("any gymnastics going on at the moment?", "under_way", {"sport": "gymnastics"}, focus="status",
      says=[disc_name(c) for c in live("gymnastics")],
      never=[disc_name(c) for c in live() if CON[c]["sport"] != "gymnastics"], tags=["constraint"]))
add(T("when's the women's 100m final", "contest_time", {"contest": W100}, focus="when", says=[hhmm(W100)],
      tags=["contraction"]))
add(T("where is the women's basketball final being played", "contest_time", {"contest": BW}, focus="where",
      says=[CON[BW]["venue"]], tags=["exact"]))
add(T("what time does the men's vault start", "contest_time", {"contest": GMVT}, focus="when",
      says=[hhmm(GMVT)], tags=["exact"]))
add(T("who's leading the women's all-around", "live_leader", {"contest": GWAA}, focus="who",
      says=leader_says(GWAA), tags=["contraction"]))
add(T("whos winning the high jump rn", "live_leader", {"contest": MHJ}, focus="who",
      says=leader_says(MHJ)[:1], tags=["abbreviation"]))
add(T("best time in the women's 100 so far?", "best_mark", {"discipline": "athletics/100m", "category": "women"},
      focus="mark", says=[best_mark("athletics", "100m", "women")[0]] + best_mark("athletics", "100m", "women")[1],
      tags=["tie", "constraint"]))
add(T("longest men's long jump of the games", "best_mark", {"discipline": "athletics/long-jump", "category": "men"},
      focus="mark", says=[best_mark("athletics", "long-jump", "men")[0]], tags=["constraint"]))
add(T("best score on women's floor?", "best_mark", {"discipline": "gymnastics/floor", "category": "women"},
      focus="mark", says=[best_mark("gymnastics", "floor", "women")[0]], tags=["constraint"]))
add(T("highest high jump by a woman so far", "best_mark", {"discipline": "athletics/high-jump", "category": "women"},
      outcome="no_data", focus="mark", tags=["uncovered", "not_yet"]))

# --- chat
add(T("hello there", "greeting", {}, focus="chat", tags=["chat"]))
add(T("what sort of things can I ask you?", "help", {}, focus="chat", tags=["chat"]))
add(T("thanks a lot!", "thanks", {}, focus="chat", tags=["chat"]))
add(T("asdfgh qwerty", "none", outcome="not_understood", focus="other", tags=["gibberish"]))
add(T("can you recommend a good pizza place near the harbour", "none", outcome="not_understood", focus="other",
      tags=["off_beat"]))

# --- voice questions, as speech recognition writes them
add(T("who won the womens one hundred metres free style", "podium", {"contest": SW100F}, focus="who",
      says=[winner(SW100F)], tags=["voice", "number_words"]))
add(T("how did hot hick new vasco do in the butterfly", "competitor_result", {"competitor": "p072", "contest": SM200FLY},
      focus="how_did", says=result_says("p072", SM200FLY), tags=["voice", "mishearing"]))
add(T("what country is zoe quill on from", "competitor_delegation", {"competitor": "p196"}, focus="group_of",
      says=[GN("quessary")], tags=["voice", "mishearing", "diacritics"]))
add(T("where is kal ven mark in the medal table", "delegation_medals", {"group": "kalvenmark"}, focus="rank",
      says=[rank_of("kalvenmark")], tags=["voice", "mishearing"]))
add(T("who won the men's two hundred butterfly", "podium", {"contest": SM200FLY}, focus="who",
      says=[winner(SM200FLY)], tags=["voice", "number_words"]))
add(T("when does lou cha wenderow compete next", "competitor_next", {"competitor": "p175"}, outcome="no_data",
      focus="when", tags=["voice", "mishearing", "uncovered", "nothing_left"]))
add(T("whats on tomorrow in swimming", "schedule_day", {"date": TOMORROW, "sport": "swimming"}, focus="schedule",
      says=[hhmm(c) for c in on_day(TOMORROW, "swimming")], tags=["voice", "relative_day", "constraint"]))
add(T("who came third in the men's high jump so far", "contest_place",
      {"contest": MHJ, "place": "3"}, focus="who", says=at_place(MHJ, 3), tags=["voice", "live"]))
add(T("how many medals has the orrin dell isles got", "delegation_medals", {"group": "orrindel"}, focus="count",
      says=[count_word(group_count("orrindel"))], tags=["voice", "mishearing"]))
add(T("tell me how trem a zul ren did in the marathon", "competitor_result", {"competitor": "p153", "contest": WMAR},
      focus="how_did", says=result_says("p153", WMAR), tags=["voice", "mishearing"]))

# --- more variety
add(T("Galkace 100m margin of victory?", "competitor_margin", {"competitor": "p005", "contest": M100},
      focus="margin", says=margin_says("p005", M100), tags=["partial", "terse"]))
add(T("did Drada Brorrorn get a medal in the 400", "competitor_result", {"competitor": "p139", "contest": W400},
      focus="whether", tags=["dsq"]))
add(T("how did Zosard Krurvasko go in the 1500", "competitor_result", {"competitor": "p031", "contest": M1500},
      focus="how_did", never=[ordinal(len(CON[M1500]["entries"]))], tags=["dns"]))
add(T("Tavish Merrow Kaine road race?", "competitor_result", {"competitor": "p092", "contest": CMRR},
      focus="how_did", tags=["dnf", "terse"]))
add(T("was cidys cusolick in the top 3 in the marathon", "competitor_result", {"competitor": "p155", "contest": WMAR},
      focus="whether", tags=["dnf"]))
add(T("who got the silver in the mens basketball", "medalist", {"contest": BM, "award": "silver"}, focus="who",
      says=medal_names(BM, "silver"), never=medal_names(BM, "gold"), tags=["exact"]))
add(T("which nation won bronze in the double sculls", "medalist", {"contest": RM2X, "award": "bronze"}, focus="who",
      says=medal_names(RM2X, "bronze"), tags=["exact"]))
add(T("Didine Zoserasko — how far ahead was she?", "competitor_margin", {"competitor": "p202", "contest": RW1X},
      focus="margin", says=margin_says("p202", RW1X), tags=["exact"]))
add(T("when is Anais Cordvelle racing next", "competitor_next", {"competitor": "p124"}, focus="when",
      says=[hhmm(next_of("p124"))], tags=["diacritics"]))
add(T("how many medals did Quessary win yesterday?", "delegation_medals", {"group": "quessary", "date": YESTERDAY},
      focus="count", says=[count_word(group_count("quessary", date=YESTERDAY))], tags=["relative_day", "constraint"]))
add(T("what's on at the stadium tomorrow night", "none", outcome="not_covered", focus="schedule",
      tags=["uncovered", "constraint", "place"]))

# --- more voice and variety
add(T("who won the womens two hundred metres", "podium", {"contest": W200}, focus="who", says=[winner(W200)],
      tags=["voice", "number_words"]))
add(T("how many medals has bell more got", "delegation_medals", {"group": "brellmoor"}, focus="count",
      says=[count_word(group_count("brellmoor"))], tags=["voice", "mishearing"]))
add(T("who won the mens four hundred metres", "podium", {"contest": M400}, focus="who", says=[winner(M400)],
      tags=["voice", "number_words"]))
add(T("what did hinaline hant and al swim in the two hundred free", "competitor_result",
      {"competitor": "p186", "contest": SW200F}, focus="mark",
      says=[fmt_mark(SW200F, entry_of("p186", SW200F)["mark"])], tags=["voice", "mishearing"]))
add(T("is anna is cord vell running in the hundred metres final tomorrow", "competitor_next",
      {"competitor": "p124"}, focus="whether", says=[hhmm(next_of("p124"))] if next_of("p124") == W100 else [],
      tags=["voice", "mishearing", "relative_day"]))
add(T("show me the top eight in the medal table", "medal_table_top", {"count": "8"}, focus="table",
      says=top_n(8), never=top_n(9)[8:], tags=["number_words"]))
add(T("who came seventh in the womens javelin", "contest_place", {"contest": WJAV, "place": "7"}, focus="who",
      says=at_place(WJAV, 7), tags=["voice", "number_words"]))
add(T("which sport does gerrard colane do", "competitor_sport", {"competitor": "p015"}, focus="sport_of",
      says=[sport_name("p015")], tags=["voice"]))
add(T("whats the longest javelin throw by a woman", "best_mark", {"discipline": "athletics/javelin", "category": "women"},
      focus="mark", says=[best_mark("athletics", "javelin", "women")[0]], tags=["voice", "constraint"]))
add(T("how many medals has the quay rocket won", "competitor_medals", {"competitor": "p005"}, focus="count",
      says=[count_word(len(medals_of("p005")))], tags=["voice", "alias"]))
add(T("whos winning the mens marathon and by how much", "live_leader", {"contest": MMAR}, focus="margin",
      says=leader_says(MMAR)[:1], tags=["voice", "live"]))
add(T("did kalvin mark win the mens long jump", "delegation_in_event", {"group": "kalvenmark", "contest": MLJ},
      focus="whether", says=[N("p049")], tags=["voice", "mishearing"]))
add(U("how many laps of the harbour loop is the marathon", tags=["voice"]))
add(U("what was the temperature at the start of the womens marathon", tags=["voice", "weather"]))
add(U("who was slowest across both womens hundred metre heats", focus="who", tags=["voice", "constraint", "round"]))
add(U("list every athlete from Pellavia", focus="other"))
add(U("which events are still to be decided", focus="open"))
add(U("how many golds are still up for grabs this weekend", focus="count"))
add(U("medal table for rowing and cycling combined", focus="table", tags=["constraint"]))

# --- uncovered singles
add(U("how old is Wonorin Galkace?"))
add(U("how tall is big tobi", tags=["alias"]))
add(U("is Anaïs Cordvelle carrying an injury into the final"))
add(U("what time is the closing ceremony", focus="when"))
add(U("where can i get tickets for the women's 100 final"))
add(U("what's the weather looking like for the men's time trial on tuesday", tags=["constraint"]))
add(U("what's the games record for the men's 1500", focus="mark", never=[mark_of(M1500, 1)]))
add(U("who won the womens 400 at the last games", focus="who", never=[winner(W400)]))
add(U("which channel is showing the basketball final"))
add(U("who coaches the Dunmerrow basketball team"))
add(U("how many athletes has Quessary brought to the games", focus="count"))
add(U("who scored the most points in the men's basketball final", focus="who"))
add(U("what was the wind reading in the men's 100m final", focus="mark"))
add(U("which athlete has the most gold medals of anyone", focus="who"))
add(U("has anyone failed a drug test"))
add(U("how much prize money do gold medallists get"))
add(U("what's the medal table look like for women's events only", focus="table",
      tags=["constraint", "category"]))
add(U("who won medals at the Tidewell Aquatic Centre yesterday", focus="who", tags=["constraint", "place"]))
add(U("who carried the flag for Halvorne at the opening", focus="who"))
add(U("what are Zoë Quillon's split times in the 200 free", focus="mark"))
add(U("wat was the crowd like at the sprint final"))
add(U("whens the next edition of the lowenfirth coast games", focus="when"))

# ================================================================ conversations
add(CONV(
    T("who won the men's 100m?", "podium", {"contest": M100}, focus="who", says=[winner(M100)], tags=["exact"]),
    T("what was his time", "competitor_result", {"competitor": "p005", "contest": M100}, focus="mark",
      says=[fmt_mark(M100, entry_of("p005", M100)["mark"])], tags=["pronoun", "follow_up"]),
    T("and by how much did he win", "competitor_margin", {"competitor": "p005", "contest": M100}, focus="margin",
      says=margin_says("p005", M100), tags=["pronoun", "follow_up"]),
    T("thx", "thanks", {}, focus="chat", tags=["chat"]),
    tags=["follow_up", "pronoun"]))

add(CONV(
    T("hows the mens javelin going", "live_leader", {"contest": MJAV}, focus="who",
      says=leader_says(MJAV), tags=["contraction", "live"]),
    T("by how much is he ahead?", "live_leader", {"contest": MJAV}, focus="margin", says=[lead_gap(MJAV)],
      tags=["pronoun", "follow_up"]),
    T("who's second", "contest_place", {"contest": MJAV, "place": "2"}, focus="who", says=at_place(MJAV, 2),
      tags=["ellipsis", "follow_up"]),
    T("which delegation is he from", "competitor_delegation", {"competitor": "p065"}, focus="group_of",
      says=[GN(COMP["p065"]["group"])], tags=["pronoun", "follow_up"]),
    tags=["follow_up", "pronoun", "live"]))

add(CONV(
    T("how did Zoe do", "competitor_profile", outcome="clarify", focus="profile",
      says=[N("p196"), N("p199"), N("p219")], tags=["ambiguous", "clarify"]),
    T("the swimmer", "competitor_profile", {"competitor": "p196"}, focus="profile",
      says=[fmt_mark(c, entry_of("p196", c)["mark"]) for c in contests_of("p196") if CON[c]["status"] == "final"],
      tags=["follow_up"]),
    T("when's she racing next?", "competitor_next", {"competitor": "p196"}, focus="when",
      says=[hhmm(next_of("p196"))], tags=["pronoun", "follow_up"]),
    T("cheers", "thanks", {}, focus="chat", tags=["chat"]),
    tags=["clarify", "ambiguous", "pronoun"]))

add(CONV(
    T("medal table", "medal_table_top", {}, focus="table", says=top_n(3), tags=["terse"]),
    T("where's Vastrelia", "delegation_medals", {"group": "vastrelia"}, focus="rank", says=[rank_of("vastrelia")],
      tags=["follow_up"]),
    T("how many golds have they got", "delegation_medals", {"group": "vastrelia", "award": "gold"}, focus="count",
      says=[count_word(group_count("vastrelia", "gold"))], tags=["pronoun", "follow_up"]),
    T("and Halvorne?", "delegation_medals", {"group": "halvorne", "award": "gold"}, focus="count",
      says=[count_word(group_count("halvorne", "gold"))], tags=["ellipsis", "follow_up"]),
    tags=["follow_up", "ellipsis"]))

add(CONV(
    T("what's on tomorrow", "schedule_day", {"date": TOMORROW}, focus="schedule",
      says=[hhmm(c) for c in on_day(TOMORROW)], tags=["relative_day"]),
    T("what time is the swimming", "contest_time", {"contest": SW400IM}, focus="when", says=[hhmm(SW400IM)],
      tags=["follow_up", "ellipsis"]),
    T("and where?", "contest_time", {"contest": SW400IM}, focus="where", says=[CON[SW400IM]["venue"]],
      tags=["ellipsis", "follow_up"]),
    U("will it be sold out do you think", tags=["follow_up"]),
    tags=["follow_up", "relative_day"]))

add(CONV(
    T("who won the men's basketball final", "podium", {"contest": BM}, focus="who", says=[winner(BM)],
      tags=["exact"]),
    T("what was the score", "full_results", {"contest": BM}, focus="mark", says=[mark_of(BM, 1), mark_of(BM, 2)],
      tags=["follow_up"]),
    U("who was their top scorer", focus="who", tags=["pronoun", "follow_up"]),
    T("who finished last?", "contest_place", {"contest": BM, "place": str(last_place(BM))}, focus="who",
      says=at_place(BM, last_place(BM)), tags=["follow_up", "last"]),
    tags=["follow_up", "change_of_subject"]))

add(CONV(
    T("did Hulek Dorrago medal?", "competitor_medals", {"competitor": "p013"}, focus="whether",
      says=[a for _, a in medals_of("p013")], tags=["exact"]),
    T("how did he do in the 100 final", "competitor_result", {"competitor": "p013", "contest": M100},
      focus="how_did", says=result_says("p013", M100), tags=["pronoun", "follow_up"]),
    T("did he beat Tollevant there?", "head_to_head", {"competitor": "p013", "rival": "p007", "contest": M100},
      focus="compare", says=[ahead("p013", "p007", M100)], tags=["pronoun", "follow_up", "diacritics"]),
    T("and in the heat, was he ahead of Galkace", "head_to_head",
      {"competitor": "p013", "rival": "p005", "contest": M100H1}, focus="compare",
      says=[ahead("p013", "p005", M100H1)], tags=["constraint", "follow_up", "pronoun"]),
    tags=["follow_up", "pronoun", "constraint"]))

add(CONV(
    T("hi!", "greeting", {}, focus="chat", tags=["chat"]),
    T("what can you do", "help", {}, focus="chat", tags=["chat"]),
    T("ok who's top of the table for swimming", "medal_table_leader", {"sport": "swimming"}, focus="who",
      says=leaders("swimming"), tags=["constraint"]),
    T("and gymnastics", "medal_table_leader", {"sport": "gymnastics"}, focus="who", says=leaders("gymnastics"),
      tags=["ellipsis", "follow_up", "tie"]),
    tags=["chat", "ellipsis"]))

add(CONV(
    T("whos leading the mens marathon right now", "live_leader", {"contest": MMAR}, focus="who",
      says=leader_says(MMAR)[:1], tags=["voice", "live"]),
    T("is inigo saltreva in the top three", "competitor_result", {"competitor": "p035", "contest": MMAR},
      focus="whether", says=[ordinal(entry_of("p035", MMAR)["place"])], tags=["voice", "diacritics"]),
    T("which country is he running for", "competitor_delegation", {"competitor": "p035"}, focus="group_of",
      says=[GN(COMP["p035"]["group"])], tags=["voice", "pronoun"]),
    U("whats the course record", focus="mark", tags=["voice"]),
    tags=["voice", "pronoun", "live"]))

add(CONV(
    T("when is the women's high jump", "contest_time", {"contest": WHJ}, focus="when", says=[hhmm(WHJ)],
      tags=["exact"]),
    T("how will Halvorne do in it", "delegation_in_event", {"group": "halvorne", "contest": WHJ},
      outcome="no_data", focus="how_did", tags=["uncovered", "pronoun", "not_yet"]),
    T("ok and the men's one, who's winning?", "live_leader", {"contest": MHJ}, focus="who",
      says=leader_says(MHJ)[:1], tags=["follow_up", "ellipsis"]),
    T("by how much", "live_leader", {"contest": MHJ}, focus="margin", says=[lead_gap(MHJ)],
      tags=["ellipsis", "follow_up"]),
    tags=["follow_up", "ellipsis"]))

add(CONV(
    T("how many medals has Tetha Brelwick won", "competitor_medals", {"competitor": "p210"}, focus="count",
      says=[count_word(len(medals_of("p210")))], tags=["exact"]),
    T("what sport is she", "competitor_sport", {"competitor": "p210"}, focus="sport_of",
      says=[sport_name("p210")], tags=["pronoun"]),
    T("is she racing again?", "competitor_next", {"competitor": "p210"}, outcome="no_data", focus="when",
      tags=["pronoun", "uncovered", "nothing_left"]),
    tags=["pronoun"]))

add(CONV(
    T("results women's floor", "full_results", {"contest": GWFL}, focus="results",
      says=[entry_name(e) for e in placed(GWFL)], tags=["terse"]),
    T("just the top five please", "full_results", {"contest": GWFL, "count": "5"}, focus="results",
      says=[entry_name(e) for e in placed(GWFL)[:5]], never=[entry_name(e) for e in placed(GWFL)[5:]],
      tags=["follow_up", "number_words"]),
    T("who came 8th", "contest_place", {"contest": GWFL, "place": "8"}, focus="who", says=at_place(GWFL, 8),
      tags=["follow_up", "ellipsis"]),
    tags=["follow_up"]))

add(CONV(
    T("has Quessary won anything in the pool", "delegation_medals", {"group": "quessary", "sport": "swimming"},
      focus="count", says=[count_word(group_count("quessary", sport="swimming"))], tags=["constraint"]),
    T("what about track and field", "delegation_medals", {"group": "quessary", "sport": "athletics"},
      focus="count", says=[count_word(group_count("quessary", sport="athletics"))], tags=["follow_up", "alias"]),
    T("and how many of those are gold", "delegation_medals",
      {"group": "quessary", "sport": "athletics", "award": "gold"}, focus="count",
      says=[count_word(group_count("quessary", "gold", sport="athletics"))], tags=["follow_up", "pronoun"]),
    U("how many of their medals were won by women", focus="count", tags=["follow_up", "category"]),
    tags=["constraint", "follow_up"]))

add(CONV(
    T("who beat Nulan Bendand in the 400?", "competitor_margin", {"competitor": "p020", "contest": M400},
      focus="who", says=margin_says("p020", M400)[:1], tags=["exact"]),
    T("whats the gap between them", "competitor_margin", {"competitor": "p020", "contest": M400}, focus="margin",
      says=margin_says("p020", M400)[1:], tags=["ellipsis", "follow_up"]),
    T("what was Trilunick's time", "competitor_result", {"competitor": "p023", "contest": M400}, focus="mark",
      says=[fmt_mark(M400, entry_of("p023", M400)["mark"])], tags=["partial", "follow_up"]),
    tags=["follow_up", "ellipsis"]))

add(CONV(
    T("how did Kovendal get on", "competitor_profile", outcome="clarify", focus="profile",
      says=[N("p084"), N("p184")], tags=["ambiguous", "clarify", "partial"]),
    T("the rower", "competitor_profile", {"competitor": "p084"}, focus="profile",
      says=[fmt_mark(c, entry_of("p084", c)["mark"]) for c in contests_of("p084")], tags=["follow_up"]),
    T("what about the swimmer then", "competitor_profile", {"competitor": "p184"}, focus="profile",
      says=[fmt_mark(c, entry_of("p184", c)["mark"]) for c in contests_of("p184") if CON[c]["status"] == "final"],
      tags=["follow_up"]),
    tags=["clarify", "ambiguous"]))

add(CONV(
    T("who won the 100 metres", "podium", outcome="clarify", focus="who", says=["men", "women"],
      tags=["ambiguous", "clarify", "missing_slot"]),
    T("mens", "podium", {"contest": M100}, focus="who", says=[winner(M100)], tags=["follow_up", "ellipsis"]),
    T("and when's the women's one", "contest_time", {"contest": W100}, focus="when", says=[hhmm(W100)],
      tags=["follow_up", "ellipsis"]),
    tags=["clarify", "ambiguous"]))

add(CONV(
    T("yo whats going on right now", "under_way", {}, focus="schedule", says=[disc_name(c) for c in live()],
      tags=["chatty", "now"]),
    T("who's ahead in the gymnastics", "live_leader", {"contest": GWAA}, focus="who", says=leader_says(GWAA)[:1],
      tags=["follow_up", "constraint"]),
    T("by how many points?", "live_leader", {"contest": GWAA}, focus="margin", says=[lead_gap(GWAA)],
      tags=["follow_up", "ellipsis"]),
    T("and who's in second", "contest_place", {"contest": GWAA, "place": "2"}, focus="who",
      says=at_place(GWAA, 2), tags=["follow_up", "ellipsis"]),
    T("what delegation is she", "competitor_delegation", {"competitor": "p229"}, focus="group_of",
      says=[GN("zandrel")], tags=["pronoun", "follow_up"]),
    tags=["follow_up", "live", "chatty"]))

add(CONV(
    T("tell me about Hothic Nuvasko", "competitor_profile", {"competitor": "p072"}, focus="profile",
      says=[fmt_mark(c, entry_of("p072", c)["mark"]) for c in contests_of("p072")], tags=["exact"]),
    T("how many golds is that", "competitor_medals", {"competitor": "p072", "award": "gold"}, focus="count",
      says=[count_word(len(medals_of("p072", "gold")))], tags=["follow_up", "pronoun"]),
    U("is he the fastest breaststroker in history", focus="other", tags=["pronoun", "records"]),
    T("fair enough, who won the men's 100 breaststroke then", "podium", {"contest": SM100BR}, focus="who",
      says=[winner(SM100BR)], tags=["new_question"]),
    tags=["follow_up", "pronoun"]))

add(CONV(
    T("who won the women's 200m butterfly?", "podium", {"contest": SW200FLY}, focus="who",
      says=[winner(SW200FLY)], tags=["exact"]),
    T("and the men's", "podium", {"contest": SM200FLY}, focus="who", says=[winner(SM200FLY)],
      tags=["ellipsis", "follow_up"]),
    T("who got bronze in that", "medalist", {"contest": SM200FLY, "award": "bronze"}, focus="who",
      says=medal_names(SM200FLY, "bronze"), tags=["pronoun", "follow_up"]),
    T("what else has he won", "competitor_medals", {"competitor": "p083"}, focus="count",
      says=[count_word(len(medals_of("p083")))], tags=["pronoun", "follow_up"]),
    tags=["follow_up", "ellipsis", "pronoun"]))

add(CONV(
    T("good evening, quick one: how many golds has Kalvenmark won", "delegation_medals",
      {"group": "kalvenmark", "award": "gold"}, focus="count", says=[count_word(group_count("kalvenmark", "gold"))],
      tags=["chatty"]),
    T("is that more than anyone else?", "most_medals", {"award": "gold"}, focus="whether",
      says=leaders(award="gold"), tags=["follow_up", "pronoun"]),
    T("and in athletics only", "delegation_medals", {"group": "kalvenmark", "sport": "athletics", "award": "gold"},
      focus="count", says=[count_word(group_count("kalvenmark", "gold", sport="athletics"))],
      tags=["follow_up", "constraint"]),
    T("thanks!", "thanks", {}, focus="chat", tags=["chat"]),
    tags=["chatty", "follow_up"]))

add(CONV(
    T("what was on yesterday in gymnastics", "schedule_day", {"date": YESTERDAY, "sport": "gymnastics"},
      focus="schedule", says=[hhmm(c) for c in on_day(YESTERDAY, "gymnastics")], tags=["relative_day", "constraint"]),
    T("who won the women's one", "podium", {"contest": GWFL}, focus="who", says=[winner(GWFL)],
      tags=["follow_up", "ellipsis"]),
    T("what did she score", "competitor_result", {"competitor": "p229", "contest": GWFL}, focus="mark",
      says=[fmt_mark(GWFL, entry_of("p229", GWFL)["mark"])], tags=["pronoun"]),
    T("and how much did she win it by", "competitor_margin", {"competitor": "p229", "contest": GWFL},
      focus="margin", says=margin_says("p229", GWFL), tags=["pronoun"]),
    tags=["relative_day", "follow_up", "pronoun"]))

add(CONV(
    T("where's the men's time trial", "contest_time", {"contest": CMTT}, focus="where", says=[CON[CMTT]["venue"]],
      tags=["contraction"]),
    T("and what day", "contest_time", {"contest": CMTT}, focus="when", says=[hhmm(CMTT)],
      tags=["ellipsis", "follow_up"]),
    U("how long is the course", focus="other", tags=["follow_up"]),
    T("is Velach Mesoss riding it", "competitor_next", {"competitor": "p095"}, focus="whether",
      says=[hhmm(next_of("p095"))] if next_of("p095") == CMTT else [], tags=["follow_up", "pronoun"]),
    tags=["follow_up", "ellipsis"]))

add(CONV(
    T("did thindust zavindal win", "competitor_result", {"competitor": "p088", "contest": RM1X}, focus="whether",
      says=["gold"] if entry_of("p088", RM1X).get("award") == "gold" else [], tags=["voice"]),
    T("who was second", "contest_place", {"contest": RM1X, "place": "2"}, focus="who", says=at_place(RM1X, 2),
      tags=["voice", "follow_up"]),
    T("how close was it", "competitor_margin", {"competitor": "p088", "contest": RM1X}, focus="margin",
      says=margin_says("p088", RM1X), tags=["voice", "pronoun"]),
    T("wow ok thank you", "thanks", {}, focus="chat", tags=["voice", "chat"]),
    tags=["voice", "follow_up"]))

add(CONV(
    T("which delegation is Jørund Halmvik from?", "competitor_delegation", {"competitor": "p069"},
      focus="group_of", says=[GN("quessary")], tags=["exact", "diacritics"]),
    T("medals?", "competitor_medals", {"competitor": "p069"}, focus="count",
      says=[count_word(len(medals_of("p069")))], tags=["ellipsis"]),
    T("which race was that medal in", "competitor_medals", {"competitor": "p069"}, focus="how_did",
      says=[a for _, a in medals_of("p069")], tags=["follow_up"]),
    T("who beat him in that race", "competitor_margin", {"competitor": "p069", "contest": SM200F}, focus="who",
      says=margin_says("p069", SM200F)[:1], tags=["pronoun", "follow_up"]),
    tags=["ellipsis", "follow_up", "pronoun"]))

add(CONV(
    T("medal table top 3 please", "medal_table_top", {"count": "3"}, focus="table", says=top_n(3),
      tags=["terse"]),
    T("what about just today", "medal_table_top", {"date": TODAY, "count": "3"}, focus="table",
      says=top_n(3, date=TODAY), tags=["relative_day", "follow_up"]),
    U("and adjusted for population?", focus="table", tags=["follow_up"]),
    tags=["relative_day", "follow_up"]))

add(CONV(
    T("hey, who won the women's 400m", "podium", {"contest": W400}, focus="who", says=[winner(W400)],
      tags=["chatty"]),
    T("who was fourth", "contest_place", {"contest": W400, "place": "4"}, focus="who", says=at_place(W400, 4),
      tags=["follow_up", "number_words"]),
    T("and last?", "contest_place", {"contest": W400, "place": str(last_place(W400))}, focus="who",
      says=at_place(W400, last_place(W400)), never=[N("p139")], tags=["follow_up", "last", "dsq"]),
    U("why was Drada Brorrorn disqualified", tags=["follow_up"]),
    tags=["follow_up", "last"]))

add(CONV(
    T("has pevelle cosevmont won anything", "competitor_medals", {"competitor": "p197"}, focus="whether",
      says=[a for _, a in medals_of("p197")], tags=["voice"]),
    T("when does she swim next", "competitor_next", {"competitor": "p197"}, focus="when",
      says=[hhmm(next_of("p197"))], tags=["pronoun"]),
    T("and how will brellmoor go in that one", "delegation_in_event", {"group": "brellmoor", "contest": SW400IM},
      outcome="no_data", focus="how_did", tags=["follow_up", "uncovered", "not_yet"]),
    tags=["pronoun", "follow_up"]))

add(CONV(
    T("what sport does Vedas Rossanago do", "competitor_sport", {"competitor": "p110"}, focus="sport_of",
      says=[sport_name("p110")], tags=["exact"]),
    T("how did he do in the all around", "competitor_result", {"competitor": "p110", "contest": GMAA},
      focus="how_did", says=result_says("p110", GMAA), tags=["pronoun"]),
    T("who won it", "podium", {"contest": GMAA}, focus="who", says=[winner(GMAA)], tags=["pronoun"]),
    T("how much did Rossanago lose by", "competitor_margin", {"competitor": "p110", "contest": GMAA},
      focus="margin", says=margin_says("p110", GMAA), tags=["partial"]),
    tags=["pronoun", "follow_up"]))

add(CONV(
    T("who won bronze in the women's road race", "medalist", {"contest": CWRR, "award": "bronze"}, focus="who",
      says=medal_names(CWRR, "bronze"), tags=["exact"]),
    T("did she get another medal in the time trial", "competitor_result", {"competitor": "p207", "contest": CWTT},
      focus="whether", says=[entry_of("p207", CWTT)["award"]], tags=["pronoun"]),
    T("how old is she", "none", outcome="not_covered", focus="other", tags=["uncovered", "pronoun"]),
    tags=["pronoun"]))

add(CONV(
    T("anything on in rowing today", "schedule_day", {"date": TODAY, "sport": "rowing"}, focus="schedule",
      says=[], never=[hhmm(c) for c in on_day(TODAY)] if not on_day(TODAY, "rowing") else [],
      tags=["relative_day", "constraint"]),
    T("what about monday, any rowing then?", "schedule_day", {"date": "2027-08-16", "sport": "rowing"},
      focus="schedule",
      says=[hhmm(c) for c in on_day("2027-08-16", "rowing")], tags=["follow_up"]),
    T("are orrindel the defending champs in the women's double", "none", outcome="not_covered", focus="other",
      tags=["uncovered", "follow_up", "past_editions"]),
    tags=["relative_day", "follow_up"]))

add(CONV(
    T("who won the men's 200", "podium", {"contest": M200}, focus="who", says=[winner(M200)], tags=["exact"]),
    T("and silver?", "medalist", {"contest": M200, "award": "silver"}, focus="who",
      says=medal_names(M200, "silver"), never=[winner(M200)], tags=["ellipsis"]),
    T("was he also in the 100 final", "competitor_result", {"competitor": "p013", "contest": M100},
      focus="how_did", says=result_says("p013", M100), tags=["pronoun"]),
    T("thanks. now what about the women's 200, who won that", "podium", {"contest": W200}, focus="who",
      says=[winner(W200)], tags=["thanks_between", "new_question"]),
    T("how big was her winning margin", "competitor_margin", {"competitor": "p131", "contest": W200}, focus="margin",
      says=margin_says("p131", W200), tags=["ellipsis"]),
    tags=["ellipsis", "pronoun", "thanks_between"]))

add(CONV(
    T("is Krundena Dovonasko winning the all-around", "live_leader", {"contest": GWAA}, focus="whether",
      says=leader_says(GWAA), tags=["exact", "live"]),
    T("has she won any medals so far", "competitor_medals", {"competitor": "p230"}, focus="count",
      says=[a for _, a in medals_of("p230")], tags=["pronoun"]),
    T("and what's next for her after tonight", "competitor_next", {"competitor": "p230"}, focus="when",
      says=[hhmm(next_of("p230"))], tags=["pronoun"]),
    tags=["pronoun", "live"]))

add(CONV(
    T("which delegation has the most medals", "most_medals", {}, focus="who", says=most_medals()[0],
      tags=["tie"]),
    T("and the most bronzes?", "most_medals", {"award": "bronze"}, focus="who",
      says=leaders(award="bronze"), tags=["ellipsis", "constraint"]),
    T("how many is that for Myrrhaven", "delegation_medals", {"group": "myrrhaven", "award": "bronze"},
      focus="count", says=[count_word(group_count("myrrhaven", "bronze"))], tags=["follow_up"]),
    tags=["ellipsis", "follow_up"]))

add(CONV(
    T("whats the fastest 100 free time for men", "best_mark",
      {"discipline": "swimming/100m-freestyle", "category": "men"}, focus="mark",
      says=[best_mark("swimming", "100m-freestyle", "men")[0]], tags=["alias"]),
    T("who swam it", "best_mark", {"discipline": "swimming/100m-freestyle", "category": "men"}, focus="who",
      says=best_mark("swimming", "100m-freestyle", "men")[1], tags=["pronoun"]),
    U("is that a world record", focus="other", tags=["records", "pronoun"]),
    tags=["pronoun"]))

add(CONV(
    T("Bonjour! who's the Quay Rocket?", "competitor_profile", {"competitor": "p005"}, focus="profile",
      says=[N("p005")], tags=["alias", "chatty"]),
    T("what delegation", "competitor_delegation", {"competitor": "p005"}, focus="group_of",
      says=[GN("quessary")], tags=["ellipsis"]),
    T("how many golds", "competitor_medals", {"competitor": "p005", "award": "gold"}, focus="count",
      says=[count_word(len(medals_of("p005", "gold")))], tags=["ellipsis"]),
    U("does he have a sponsor", tags=["pronoun"]),
    tags=["alias", "ellipsis"]))

add(CONV(
    T("who got gold in the mens single scull", "medalist", {"contest": RM1X, "award": "gold"}, focus="who",
      says=medal_names(RM1X, "gold"), tags=["misspelling"]),
    T("and the womens", "medalist", {"contest": RW1X, "award": "gold"}, focus="who",
      says=medal_names(RW1X, "gold"), tags=["ellipsis"]),
    T("where was that held", "contest_time", {"contest": RW1X}, focus="where", says=[CON[RW1X]["venue"]],
      tags=["pronoun"]),
    tags=["ellipsis", "pronoun"]))

add(CONV(
    T("how did Tolmerin do in the womens 200 fly", "delegation_in_event", {"group": "tolmerin", "contest": SW200FLY},
      focus="how_did", says=[N("p190"), entry_of("p190", SW200FLY)["award"]], tags=["alias"]),
    T("what was her time", "competitor_result", {"competitor": "p190", "contest": SW200FLY}, focus="mark",
      says=[fmt_mark(SW200FLY, entry_of("p190", SW200FLY)["mark"])], tags=["pronoun"]),
    T("was she ahead of brunia rantago", "head_to_head", {"competitor": "p190", "rival": "p195", "contest": SW200FLY},
      focus="compare", says=[ahead("p190", "p195", SW200FLY)], tags=["pronoun"]),
    T("by how much?", "competitor_margin", {"competitor": "p190", "contest": SW200FLY}, focus="margin",
      says=margin_says("p190", SW200FLY), tags=["ellipsis"]),
    tags=["pronoun", "ellipsis"]))

add(CONV(
    T("what's on monday in gymnastics", "schedule_day", {"date": "2027-08-16", "sport": "gymnastics"},
      focus="schedule", says=[hhmm(c) for c in on_day("2027-08-16", "gymnastics")], tags=["relative_day", "constraint"]),
    T("is Zoë Tassevar in it", "competitor_next", {"competitor": "p219"}, focus="whether",
      says=[hhmm(next_of("p219"))], tags=["follow_up", "pronoun"]),
    T("how's she doing in the all-around tonight", "competitor_result", {"competitor": "p219", "contest": GWAA},
      focus="how_did", says=[ordinal(entry_of("p219", GWAA)["place"])], tags=["live", "follow_up"]),
    tags=["relative_day", "follow_up"]))

add(CONV(
    T("how many medals has Zandrel Reach won", "delegation_medals", {"group": "zandrel"}, focus="count",
      says=[count_word(group_count("zandrel"))], tags=["exact"]),
    T("and what place are they in the table", "delegation_medals", {"group": "zandrel"}, focus="rank",
      says=[rank_of("zandrel")], tags=["pronoun"]),
    T("how'd they do in the basketball", "delegation_in_event", {"group": "zandrel", "contest": BM}, focus="how_did",
      says=[entry_of("p253", BM)["award"]], tags=["pronoun", "contraction"]),
    U("who was their best player in the final", focus="who", tags=["pronoun"]),
    tags=["pronoun"]))

add(CONV(
    T("who came second in the women's marathon", "contest_place", {"contest": WMAR, "place": "2"}, focus="who",
      says=at_place(WMAR, 2), tags=["exact"]),
    T("how far behind the winner was she", "competitor_margin", {"competitor": "p151", "contest": WMAR},
      focus="margin", says=margin_says("p151", WMAR)[:1], tags=["pronoun"]),
    T("and is the men's marathon finished yet", "live_leader", {"contest": MMAR}, focus="status",
      says=leader_says(MMAR)[:1], tags=["status", "new_question"]),
    U("how hot is it out on the harbour loop", tags=["weather"]),
    tags=["pronoun", "new_question"]))

add(CONV(
    T("who did Lirust Dosavorn lose to in the 100", "competitor_margin", {"competitor": "p001", "contest": M100},
      focus="who", says=margin_says("p001", M100)[:1], tags=["exact"]),
    T("he won his heat though didn't he", "competitor_result", {"competitor": "p001", "contest": M100H1},
      focus="whether", says=[ordinal(entry_of("p001", M100H1)["place"])], tags=["pronoun", "constraint"]),
    T("what was his heat time", "competitor_result", {"competitor": "p001", "contest": M100H1}, focus="mark",
      says=[fmt_mark(M100H1, entry_of("p001", M100H1)["mark"])], tags=["pronoun", "constraint"]),
    tags=["pronoun", "constraint"]))

add(CONV(
    T("fastest heat time in the men's 100?", "best_mark",
      {"discipline": "athletics/100m", "category": "men", "round": "heat"}, focus="mark",
      says=list(min(((fmt_mark(M100H1, e["mark"]), entry_name(e)) for c in (M100H1, M100H2) for e in placed(c)),
                    key=lambda x: secs(x[0][:-2]))),
      tags=["constraint", "round"]),
    T("and in the final?", "best_mark", {"discipline": "athletics/100m", "category": "men", "round": "final"},
      focus="mark", says=[mark_of(M100, 1)], tags=["ellipsis", "round"]),
    tags=["constraint", "ellipsis"]))

add(CONV(
    NOEVENT("who won the mixed 4x400 relay", "podium", "who", never=[winner(W400), winner(M400)],
            tags=["no_event"]),
    T("ok what about the women's 400", "podium", {"contest": W400}, focus="who", says=[winner(W400)],
      tags=["follow_up"]),
    T("and what was the time", "competitor_result", {"competitor": "p137", "contest": W400}, focus="mark",
      says=[mark_of(W400, 1)], tags=["ellipsis"]),
    tags=["no_event", "follow_up"]))

add(CONV(
    T("how did estravane do today", "delegation_medals", {"group": "estravane", "date": TODAY}, focus="count",
      tags=["relative_day", "voice", "zero"]),
    T("have they won any medals at all", "delegation_medals", {"group": "estravane"}, focus="whether",
      tags=["pronoun", "zero"]),
    T("who was their best finisher in the womens road race", "delegation_in_event",
      {"group": "estravane", "contest": CWRR}, focus="how_did", says=[N("p212")], tags=["pronoun"]),
    T("lol ok. what's the best hotel near the stadium", "none", outcome="not_understood", focus="other",
      tags=["off_beat"]),
    tags=["pronoun", "relative_day"]))

add(CONV(
    T("wat time is the womens basketbal final", "contest_time", {"contest": BW}, focus="when", says=[hhmm(BW)],
      tags=["misspelling"]),
    T("can i stream it for free anywhere", "none", outcome="not_covered", focus="other",
      tags=["uncovered", "pronoun"]),
    T("did Myrrhaven's women get a medal in the 200 free", "delegation_in_event",
      {"group": "myrrhaven", "contest": SW200F}, focus="whether", says=[entry_of("p183", SW200F)["award"]],
      tags=["new_question"]),
    T("and who beat her", "competitor_margin", {"competitor": "p183", "contest": SW200F}, focus="who",
      says=margin_says("p183", SW200F)[:1], tags=["pronoun"]),
    tags=["misspelling", "pronoun"]))

add(CONV(
    T("who won the womens long jump", "podium", {"contest": WLJ}, focus="who", says=[winner(WLJ)],
      tags=["voice"]),
    T("how far", "competitor_result", {"competitor": "p166", "contest": WLJ}, focus="mark",
      says=[mark_of(WLJ, 1)], tags=["voice", "ellipsis"]),
    T("and who came second", "contest_place", {"contest": WLJ, "place": "2"}, focus="who",
      says=at_place(WLJ, 2), tags=["voice", "ellipsis"]),
    T("what country is she from", "competitor_delegation", {"competitor": "p161"}, focus="group_of",
      says=[GN(COMP["p161"]["group"])], tags=["voice", "pronoun"]),
    U("is she the european champion", tags=["voice", "pronoun"]),
    tags=["voice", "ellipsis", "pronoun"]))

add(CONV(
    T("whos the fastest woman in the 1500", "podium", {"contest": W1500}, focus="who", says=[winner(W1500)],
      tags=["contraction"]),
    T("did Cenna Dulvaire get a medal", "competitor_result", {"competitor": "p140", "contest": W1500},
      focus="whether", says=[entry_of("p140", W1500)["award"]], tags=["diacritics"]),
    T("how far off gold", "competitor_margin", {"competitor": "p140", "contest": W1500}, focus="margin",
      says=margin_says("p140", W1500)[1:], tags=["ellipsis"]),
    T("appreciate it", "thanks", {}, focus="chat", tags=["chat"]),
    tags=["diacritics", "ellipsis"]))

add(CONV(
    T("Is Kalvenmark ahead of Quessary in the table?", "delegation_medals", {"group": "kalvenmark"},
      focus="whether", says=[rank_of("kalvenmark")], tags=["compare_groups"]),
    T("and Brellmoor, where are they", "delegation_medals", {"group": "brellmoor"}, focus="rank",
      says=[rank_of("brellmoor")], tags=["follow_up", "tie"]),
    T("how many silvers do they have", "delegation_medals", {"group": "brellmoor", "award": "silver"},
      focus="count", says=[count_word(group_count("brellmoor", "silver"))], tags=["pronoun"]),
    tags=["follow_up", "pronoun"]))

add(CONV(
    T("evening! who's winning the men's high jump", "live_leader", {"contest": MHJ}, focus="who",
      says=leader_says(MHJ), tags=["chatty", "live"]),
    T("what's the bar at", "none", outcome="not_covered", focus="mark", tags=["uncovered", "follow_up"]),
    T("where's Thadach Cossasko", "competitor_result", {"competitor": "p059", "contest": MHJ}, focus="how_did",
      says=[ordinal(entry_of("p059", MHJ)["place"])], tags=["follow_up"]),
    T("is he ahead of Thorrel Brastane", "head_to_head", {"competitor": "p059", "rival": "p056", "contest": MHJ},
      focus="compare", says=[ahead("p059", "p056", MHJ)], tags=["pronoun"]),
    tags=["live", "follow_up"]))

add(CONV(
    T("men's 1500 results", "full_results", {"contest": M1500}, focus="results",
      says=[entry_name(e) for e in placed(M1500)[:3]], tags=["terse"]),
    T("did Krurvasko finish?", "competitor_result", {"competitor": "p031", "contest": M1500}, focus="whether",
      never=[ordinal(len(CON[M1500]["entries"]))], tags=["partial", "dns"]),
    T("how many medals did Pellavia get there", "delegation_in_event", {"group": "pellavia", "contest": M1500},
      focus="how_did", says=[entry_of("p025", M1500)["award"]], tags=["follow_up"]),
    tags=["follow_up"]))

add(CONV(
    T("What time is the women's 400 IM tomorrow?", "contest_time", {"contest": SW400IM}, focus="when",
      says=[hhmm(SW400IM)], tags=["relative_day"]),
    T("who's favourite", "none", outcome="not_covered", focus="other", tags=["uncovered", "prediction"]),
    T("ok, how did Nisette Kralkayne do in the 100 breast", "competitor_result",
      {"competitor": "p191", "contest": SW100BR}, focus="how_did", says=result_says("p191", SW100BR),
      tags=["alias", "new_question"]),
    T("who won that", "podium", {"contest": SW100BR}, focus="who", says=[winner(SW100BR)], tags=["pronoun"]),
    T("which delegation is the winner from", "competitor_delegation", {"competitor": "p184"}, focus="group_of",
      says=[GN(COMP["p184"]["group"])], tags=["follow_up"]),
    tags=["relative_day", "pronoun"]))

add(CONV(
    T("hi there, which events does Krassorin Virrosand swim", "competitor_sport", {"competitor": "p074"},
      focus="sport_of", says=[sport_name("p074")] + events_of("p074"), tags=["chatty"]),
    T("best result?", "competitor_profile", {"competitor": "p074"}, focus="profile",
      says=[ordinal(min(entry_of("p074", c)["place"] for c in contests_of("p074")))], tags=["ellipsis"]),
    U("what's his personal best in the 100 free", focus="mark", tags=["pronoun", "records"]),
    tags=["chatty", "ellipsis"]))

add(CONV(
    T("whos leading in the javlin", "live_leader", {"contest": MJAV}, focus="who", says=leader_says(MJAV)[:1],
      tags=["misspelling", "live"]),
    T("how did the women's javelin end up", "podium", {"contest": WJAV}, focus="results", says=podium(WJAV),
      tags=["new_question"]),
    T("how far did the winner throw", "competitor_result", {"competitor": "p175", "contest": WJAV}, focus="mark",
      says=[mark_of(WJAV, 1)], tags=["follow_up"]),
    T("and by how much did she win", "competitor_margin", {"competitor": "p175", "contest": WJAV}, focus="margin",
      says=margin_says("p175", WJAV), tags=["pronoun"]),
    tags=["misspelling", "follow_up"]))

add(CONV(
    T("where's the men's road race", "contest_time", {"contest": CMRR}, outcome="no_data", focus="where",
      tags=["uncovered", "no_venue"]),
    T("ok so who was the winner", "podium", {"contest": CMRR}, focus="who", says=[winner(CMRR)], tags=["pronoun"]),
    T("how many finished", "none", outcome="not_covered", focus="count", tags=["uncovered", "follow_up"]),
    tags=["pronoun"]))

add(CONV(
    T("who won the long jump", "podium", outcome="clarify", focus="who", says=["men", "women"],
      tags=["ambiguous", "clarify", "missing_slot"]),
    T("women", "podium", {"contest": WLJ}, focus="who", says=[winner(WLJ)], never=[winner(MLJ)],
      tags=["follow_up", "ellipsis"]),
    T("and the men's winner jumped how far", "competitor_result", {"competitor": "p049", "contest": MLJ},
      focus="mark", says=[mark_of(MLJ, 1)], tags=["follow_up"]),
    tags=["clarify", "ambiguous"]))

add(CONV(
    T("when is the vault final", "contest_time", outcome="clarify", focus="when", says=["men", "women"],
      tags=["ambiguous", "clarify", "missing_slot"]),
    T("the women's one", "contest_time", {"contest": GWVT}, focus="when", says=[hhmm(GWVT)],
      tags=["follow_up", "ellipsis"]),
    T("where's that", "contest_time", {"contest": GWVT}, focus="where", says=[CON[GWVT]["venue"]],
      tags=["pronoun"]),
    T("is Barria Keraland competing?", "competitor_next", {"competitor": "p228"}, focus="whether",
      says=[hhmm(next_of("p228"))] if next_of("p228") == GWVT else [], tags=["follow_up"]),
    tags=["clarify", "ambiguous"]))

add(CONV(
    T("who came third", "contest_place", {"place": "3"}, outcome="clarify", focus="who",
      tags=["missing_slot", "clarify"]),
    T("in the men's 200", "contest_place", {"contest": M200, "place": "3"}, focus="who", says=at_place(M200, 3),
      tags=["follow_up", "ellipsis"]),
    T("and in the 100 final?", "contest_place", {"contest": M100, "place": "3"}, focus="who",
      says=at_place(M100, 3), tags=["follow_up", "ellipsis"]),
    T("so he got two bronzes?", "competitor_medals", {"competitor": "p002", "award": "bronze"}, focus="whether",
      says=[count_word(len(medals_of("p002", "bronze")))], tags=["pronoun", "number_words"]),
    tags=["clarify", "missing_slot", "ellipsis"]))


# ---------------------------------------------------------------- write
def turns():
    for c in cases:
        if "conversation" in c:
            yield from c["conversation"]
        else:
            yield c


def main():
    ts = list(turns())
    convs = [c for c in cases if "conversation" in c]
    for c in convs:
        assert 2 <= len(c["conversation"]) <= 6, c
    unc = [t for t in ts if t.get("outcome") in ("not_covered", "no_data")]
    head = (
        "# Blind question set: scenario games (The 2027 Lowenfirth Coast Games)\n"
        "# Moment: Saturday 14 August 2027, 21:10 +01:00 (Europe/Lisbon); data as of 21:04.\n"
        "# Written by tests/eval/blind/round4/label_games.py from dataset-demo/games/*.json.\n"
        f"# {len(cases)} cases, {len(ts)} turns, {len(convs)} conversations, "
        f"{len(unc)} uncovered turns ({100 * len(unc) / len(ts):.1f}%).\n"
    )
    out = os.path.join(HERE, "games.yaml")
    with open(out, "w", encoding="utf-8") as f:
        f.write(head)
        yaml.safe_dump(cases, f, allow_unicode=True, sort_keys=False, width=120)
    print(head)


if __name__ == "__main__":
    main()
