#!/usr/bin/env python3
"""Blind question set for the games scenario, labelled from the data.

Scenario: games (dataset-demo/games/), moment: Saturday 14 August 2027,
21:10 Europe/Lisbon (+01:00); data as of 21:04.

Every question below is written with its intended meaning as data (intent,
slots, what is asked).  Every expected fact (`says`, `never`, outcome) is
computed from the JSON files by the functions in this script.

Run:  python3 label_games.py        -> writes games.yaml next to this file.
"""

import collections
import json
import os
import sys
from datetime import date, datetime

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "games"))
OUT = os.path.join(HERE, "games.yaml")

SCENARIO = "games"
MOMENT = "2027-08-14T21:10+01:00"
CLOCK = datetime(2027, 8, 14, 21, 10)
TODAY = date(2027, 8, 14)


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


COMPETITORS = load("competitors.json")
CONTESTS = load("contests.json")
GROUPS = load("groups.json")
SPORTS = load("sports.json")

CM = {c["id"]: c for c in COMPETITORS}
KM = {k["id"]: k for k in CONTESTS}
GM = {g["id"]: g for g in GROUPS}
SM = {s["id"]: s for s in SPORTS}
DISC = {f'{s["id"]}/{d["id"]}': d for s in SPORTS for d in s["disciplines"]}
AWARDS = ["gold", "silver", "bronze"]

# ---------------------------------------------------------------- card
CARD = {
    "best_mark": {"discipline", "category"},
    "competitor_medals": {"competitor"},
    "competitor_next": {"competitor"},
    "competitor_profile": {"competitor"},
    "competitor_result": {"competitor", "contest"},
    "contest_time": {"contest"},
    "delegation_in_event": {"group", "contest"},
    "delegation_medals": {"group"},
    "full_results": {"contest", "count"},
    "greeting": set(),
    "head_to_head": {"competitor", "rival", "contest"},
    "help": set(),
    "live_leader": {"contest"},
    "medal_table_leader": set(),
    "medal_table_top": {"count"},
    "medalist": {"contest", "award"},
    "most_medals": set(),
    "podium": {"contest", "award"},
    "schedule_day": {"date", "sport"},
    "thanks": set(),
    "under_way": {"sport"},
}

# ---------------------------------------------------------------- lookups


def P(full):
    """Competitor id from a full name as the data spells it (must be unique)."""
    hits = [c["id"] for c in COMPETITORS if f'{c["given"]} {c["family"]}' == full]
    assert len(hits) == 1, (full, hits)
    return hits[0]


def name(cid):
    c = CM[cid]
    return f'{c["given"]} {c["family"]}'


def gname(gid):
    return GM[gid]["name"]


def entry_name(e):
    return name(e["competitor"]) if "competitor" in e else gname(e["group"])


def entry_group(e):
    return e["group"] if "group" in e else CM[e["competitor"]]["group"]


def entry_people(e):
    return [e["competitor"]] if "competitor" in e else list(e.get("members", []))


def placed(k):
    return sorted([e for e in k["entries"] if "place" in e], key=lambda e: e["place"])


def at_place(k, p):
    return [e for e in k["entries"] if e.get("place") == p]


def start_dt(k):
    return datetime.fromisoformat(k["start"])


def hhmm(k):
    return k["start"][11:16]


# ---------------------------------------------------------------- formats
WORDS = ["no", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


def count_word(n):
    return WORDS[n] if n < 10 else str(n)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def secs(mark):
    parts = mark.split(":")
    v = 0.0
    for p in parts:
        v = v * 60 + float(p)
    return v


def fmt_mark(k, mark):
    m = k["measure"]
    if m == "time":
        return mark if ":" in mark else f"{mark} s"
    if m == "distance":
        return f"{mark} m"
    return mark  # points as the data writes them


def decimals(mark):
    last = mark.split(":")[-1]
    return len(last.split(".")[1]) if "." in last else 0


def fmt_margin(k, a, b):
    m = k["measure"]
    if m == "time":
        d = abs(secs(b) - secs(a))
        dec = max(decimals(a), decimals(b))
        return f"{d:.{dec}f} s" if d < 60 else None
    d = abs(float(a) - float(b))
    dec = max(decimals(a), decimals(b))
    s = f"{d:.{dec}f}"
    if m == "distance":
        return f"{s} m"
    return s.rstrip("0").rstrip(".") if "." in s else s


def better(k, a, b):
    """True when mark a beats mark b in contest k's measure."""
    if k["measure"] == "time":
        return secs(a) < secs(b)
    return float(a) > float(b)


# ---------------------------------------------------------------- medals
def medal_table():
    t = collections.defaultdict(lambda: [0, 0, 0])
    for k in CONTESTS:
        for e in k["entries"]:
            if e.get("award") in AWARDS:
                t[entry_group(e)][AWARDS.index(e["award"])] += 1
    return {g: tuple(v) for g, v in t.items()}


TABLE = medal_table()


def rank_of(gid):
    me = TABLE.get(gid)
    if not me:
        return None
    return 1 + sum(1 for v in TABLE.values() if v > me)


def table_order():
    return sorted(TABLE, key=lambda g: (-TABLE[g][0], -TABLE[g][1], -TABLE[g][2], g))


def competitor_awards(cid):
    out = []
    for k in CONTESTS:
        for e in k["entries"]:
            if cid in entry_people(e) and e.get("award") in AWARDS:
                out.append((k["id"], e["award"]))
    return out


def competitor_contests(cid):
    return [k for k in CONTESTS if any(cid in entry_people(e) for e in k["entries"])]


def winner(cid):
    return [entry_name(e) for e in at_place(KM[cid], 1)]


def names_at(cid, p):
    return [entry_name(e) for e in at_place(KM[cid], p)]


def award_names(cid, award):
    return [entry_name(e) for e in KM[cid]["entries"] if e.get("award") == award]


# ---------------------------------------------------------------- compute
def compute(intent, s, what):
    """Return (outcome, says, never) for an intent and its slots."""
    says, never = [], []
    if intent in ("greeting", "thanks", "help"):
        return None, [], []

    if intent in ("podium", "medalist"):
        cid = s.get("contest")
        if cid is None:
            return "no_data", [], []
        k = KM[cid]
        if k["status"] != "final":
            return "no_data", [], []
        award = s.get("award")
        has_awards = any("award" in e for e in k["entries"])
        if award:
            says = award_names(cid, award)
        elif what == "winner" or not has_awards:
            says = winner(cid)
        else:
            says = [entry_name(e) for a in AWARDS for e in k["entries"] if e.get("award") == a]
        if has_awards:
            fourth = [entry_name(e) for e in k["entries"] if "place" in e and "award" not in e]
            never = fourth[:1]
        else:
            never = names_at(cid, 4) if what == "winner" else []
        return "answered", says, never

    if intent == "full_results":
        k = KM[s["contest"]]
        if k["status"] == "scheduled" or not placed(k):
            return "no_data", [], []
        rows = placed(k)
        n = int(s["count"]) if "count" in s else len(rows)
        top = [e for e in rows if e["place"] <= n]
        if what == "mark":
            says = [fmt_mark(k, e["mark"]) for e in top]
        else:
            says = [entry_name(e) for e in top]
            says.append(fmt_mark(k, top[0]["mark"]))
        if "count" in s:
            never = [entry_name(e) for e in rows if e["place"] == n + 1]
        return "answered", says, never

    if intent == "live_leader":
        k = KM[s["contest"]]
        if k["status"] == "scheduled":
            return "no_data", [], []
        lead = at_place(k, 1)
        if k["status"] == "final":
            return "answered", [entry_name(e) for e in lead], []
        second = at_place(k, 2)
        margin = fmt_margin(k, lead[0]["mark"], second[0]["mark"])
        if what == "margin":
            says = [margin]
        elif what == "leader":
            says = [entry_name(e) for e in lead]
        else:
            says = [entry_name(e) for e in lead] + [margin]
        return "answered", says, []

    if intent == "best_mark":
        sport, disc = s["discipline"].split("/")

        def best(cat):
            cands = []
            for k in CONTESTS:
                if k["sport"] != sport or k["discipline"] != disc:
                    continue
                if cat and k["category"] != cat:
                    continue
                for e in placed(k):
                    if "mark" in e:
                        cands.append((k, e))
            if not cands:
                return None, []
            top = cands[0]
            for k, e in cands[1:]:
                if better(k, e["mark"], top[1]["mark"]):
                    top = (k, e)
            holders = [entry_name(e) for k, e in cands if e["mark"] == top[1]["mark"]]
            return fmt_mark(top[0], top[1]["mark"]), sorted(set(holders))

        cat = s.get("category")
        mark, holders = best(cat)
        if mark is None:
            return "no_data", [], []
        says = [mark] + holders
        if cat:
            other = "women" if cat == "men" else "men"
            om, _ = best(other)
            if om and om != mark:
                never = [om]
        return "answered", says, never

    if intent == "competitor_medals":
        aw = competitor_awards(s["competitor"])
        if what == "gold":
            n = sum(1 for _, a in aw if a == "gold")
            return "answered", [count_word(n)] if n else [], []
        if what == "kinds":
            return "answered", sorted(set(a for _, a in aw)), []
        if not aw:
            return "answered", [], []
        return "answered", [count_word(len(aw))], []

    if intent == "competitor_next":
        cid = s["competitor"]
        up = [k for k in competitor_contests(cid)
              if k["status"] == "scheduled" and start_dt(k) > CLOCK]
        if what == "after_live":
            pass
        if not up:
            return "no_data", [], []
        up.sort(key=start_dt)
        return "answered", [hhmm(up[0])], []

    if intent == "competitor_profile":
        cid = s["competitor"]
        for k in competitor_contests(cid):
            if k["phase"] != "final":
                continue
            for e in k["entries"]:
                if cid in entry_people(e) and "mark" in e and "place" in e:
                    says.append(fmt_mark(k, e["mark"]))
        return "answered", says, []

    if intent == "competitor_result":
        cid = s["competitor"]
        if "contest" in s:
            k = KM[s["contest"]]
        else:
            ks = competitor_contests(cid)
            assert len(ks) == 1, (cid, [k["id"] for k in ks])
            k = ks[0]
        es = [e for e in k["entries"] if cid in entry_people(e)]
        if not es:
            return "no_data", [], []
        e = es[0]
        if k["status"] == "scheduled":
            return "no_data", [], []
        if "place" not in e:
            return "answered", [], []
        if what == "mark":
            says = [fmt_mark(k, e["mark"])]
        elif what == "place":
            says = [ordinal(e["place"])]
        else:
            says = [ordinal(e["place"]), fmt_mark(k, e["mark"])]
        return "answered", says, []

    if intent == "contest_time":
        if "contest" not in s:
            return "no_data", [], []
        k = KM[s["contest"]]
        venue = k.get("venue")
        if what == "where":
            return ("answered", [venue], []) if venue else ("no_data", [], [])
        says = [hhmm(k)]
        if what != "when" and venue:
            says.append(venue)
        return "answered", says, []

    if intent == "delegation_in_event":
        k = KM[s["contest"]]
        g = s["group"]
        es = [e for e in k["entries"] if entry_group(e) == g]
        if not es or k["status"] == "scheduled":
            return "no_data", [], []
        for e in es:
            if "group" not in e:
                says.append(entry_name(e))
            if "place" in e:
                says.append(ordinal(e["place"]))
        return "answered", says, []

    if intent == "delegation_medals":
        g = s["group"]
        row = TABLE.get(g, (0, 0, 0))
        if what in AWARDS:
            n = row[AWARDS.index(what)]
            return "answered", [count_word(n)] if n else [], []
        if what == "rank":
            r = rank_of(g)
            return "answered", [ordinal(r)] if r else [], []
        if sum(row) == 0:
            return "answered", [], []
        return "answered", [count_word(sum(row)), ordinal(rank_of(g))], []

    if intent == "head_to_head":
        a, b = s["competitor"], s["rival"]
        if "contest" in s:
            ks = [KM[s["contest"]]]
        else:
            ks = [k for k in competitor_contests(a) if k in competitor_contests(b)]
            assert len(ks) == 1, (a, b, [k["id"] for k in ks])
        k = ks[0]
        ea = [e for e in k["entries"] if a in entry_people(e)]
        eb = [e for e in k["entries"] if b in entry_people(e)]
        if not ea or not eb or "place" not in ea[0] or "place" not in eb[0]:
            return "no_data", [], []
        pa, pb = ea[0]["place"], eb[0]["place"]
        if pa == pb:
            return "answered", [fmt_mark(k, ea[0]["mark"])], []
        return "answered", [name(a) if pa < pb else name(b)], []

    if intent == "medal_table_leader":
        order = table_order()
        leaders = [g for g in order if rank_of(g) == 1]
        return "answered", [gname(g) for g in leaders], []

    if intent == "medal_table_top":
        n = int(s.get("count", "3"))
        order = table_order()
        says = [gname(g) for g in order if rank_of(g) <= n]
        nxt = [g for g in order if rank_of(g) > n]
        if "count" in s and nxt and rank_of(nxt[0]) == n + 1:
            never = [gname(nxt[0])]
        if "count" not in s:
            says = [gname(g) for g in order if rank_of(g) == 1]
        return "answered", says, never

    if intent == "most_medals":
        totals = {g: sum(v) for g, v in TABLE.items()}
        top = max(totals.values())
        return "answered", [gname(g) for g in sorted(totals) if totals[g] == top] + [str(top)], []

    if intent == "schedule_day":
        d = s.get("date", TODAY.isoformat())
        sport = s.get("sport")

        def times(day):
            return sorted({hhmm(k) for k in CONTESTS
                           if k["start"][:10] == day and (sport is None or k["sport"] == sport)})

        says = times(d)
        if not says:
            return "no_data", [], []
        dd = date.fromisoformat(d)
        near = set()
        for delta in (-1, 1):
            near.update(times(date.fromordinal(dd.toordinal() + delta).isoformat()))
        never = sorted(near - set(says))
        return "answered", says, never

    if intent == "under_way":
        sport = s.get("sport")
        live = [k for k in CONTESTS if k["status"] == "live"]
        mine = [k for k in live if sport is None or k["sport"] == sport]
        if not mine:
            return "no_data", [], []
        says = sorted({DISC[f'{k["sport"]}/{k["discipline"]}']["name"] for k in mine})
        others = sorted({DISC[f'{k["sport"]}/{k["discipline"]}']["name"] for k in live if k not in mine})
        return "answered", says, others

    raise ValueError(intent)


# ---------------------------------------------------------------- builders
UNCOVERED_OUTCOMES = {"not_covered", "no_data", "not_understood"}


def T(ask, intent, slots=None, focus="other", tags=(), what=None, outcome=None,
      says=None, never=None, add_never=None):
    """One turn.  intent None means `none`.  says/never overrides must come
    from the data helpers above (winner(), name(), ...)."""
    tags = list(tags)
    case = {"ask": ask}
    if intent is None:
        case["intent"] = "none"
        out = outcome or "not_covered"
        c_says, c_never = [], []
    else:
        assert intent in CARD, intent
        slots = dict(slots or {})
        for k in slots:
            assert k in CARD[intent], (intent, k)
        case["intent"] = intent
        case["slots"] = slots
        if outcome == "clarify":
            out, c_says, c_never = "clarify", [], []
        else:
            out, c_says, c_never = compute(intent, slots, what)
        if outcome:
            out = outcome
    if says is not None:
        c_says = says
    if never is not None:
        c_never = never
    if add_never:
        c_never = list(c_never) + list(add_never)
    if out:
        case["outcome"] = out
    case["focus"] = focus
    # dedupe, keep order; a fact cannot be both said and never
    c_says = list(dict.fromkeys(x for x in c_says if x))
    c_never = [x for x in dict.fromkeys(x for x in c_never if x)
               if x not in c_says and not any(x.lower() in y.lower() for y in c_says)]
    if c_says:
        case["says"] = c_says
    if c_never:
        case["never"] = c_never
    if out in UNCOVERED_OUTCOMES and "uncovered" not in tags:
        tags.append("uncovered")
    if out == "clarify" and "clarify" not in tags:
        tags.append("clarify")
    if tags:
        case["tags"] = tags
    return case


def N(ask, focus="other", tags=(), outcome="not_covered", never=None):
    """A turn no intent answers."""
    return T(ask, None, focus=focus, tags=tags, outcome=outcome, never=never)


def CONV(tags, *turns):
    assert 2 <= len(turns) <= 6, turns[0]["ask"]
    return {"conversation": list(turns), "tags": list(tags)}


def CLAR(ask, intent, slots, options, focus, tags=()):
    return T(ask, intent, slots, focus=focus, tags=tags, outcome="clarify", says=options)


# ---------------------------------------------------------------- ids
M100, MH1, MH2 = "ath-m-100m-final", "ath-m-100m-heat-1", "ath-m-100m-heat-2"
M200, M400, M1500, MLJ = "ath-m-200m-final", "ath-m-400m-final", "ath-m-1500m-final", "ath-m-long-jump-final"
W100, WH1, WH2 = "ath-w-100m-final", "ath-w-100m-heat-1", "ath-w-100m-heat-2"
W200, W400, W1500, WLJ = "ath-w-200m-final", "ath-w-400m-final", "ath-w-1500m-final", "ath-w-long-jump-final"
WMAR, MMAR = "ath-w-marathon-final", "ath-m-marathon-final"
MHJ, WHJ, MJAV, WJAV = "ath-m-high-jump-final", "ath-w-high-jump-final", "ath-m-javelin-final", "ath-w-javelin-final"
SWF100, SMF100 = "swm-w-100m-freestyle-final", "swm-m-100m-freestyle-final"
SWF200, SMF200 = "swm-w-200m-freestyle-final", "swm-m-200m-freestyle-final"
SWFLY, SMFLY = "swm-w-200m-butterfly-final", "swm-m-200m-butterfly-final"
SWBR, SMBR = "swm-w-100m-breaststroke-final", "swm-m-100m-breaststroke-final"
SWIM, SMIM = "swm-w-400m-individual-medley-final", "swm-m-400m-individual-medley-final"
RWS, RMS, RMD, RWD = ("row-w-single-sculls-final", "row-m-single-sculls-final",
                      "row-m-double-sculls-final", "row-w-double-sculls-final")
CMRR, CWRR, CWTT, CMTT = ("cyc-m-road-race-final", "cyc-w-road-race-final",
                          "cyc-w-time-trial-final", "cyc-m-time-trial-final")
GMAA, GWAA, GWFL, GMFL, GWV, GMV = ("gym-m-all-around-final", "gym-w-all-around-final",
                                    "gym-w-floor-final", "gym-m-floor-final",
                                    "gym-w-vault-final", "gym-m-vault-final")
BM, BW = "bkb-m-tournament-final", "bkb-w-tournament-final"

D_TODAY, D_TOM, D_YEST = "2027-08-14", "2027-08-15", "2027-08-13"

GALKACE = P("Wonorin Galkace")
DORRAGO = P("Hulek Dorrago")
ZOES = [P("Zoë Quillon"), P("Zoë Marrant"), P("Zoë Tassevar")]
KOVENDALS = [P("Boran Kovendal"), P("Stemelle Kovendal")]


def ppl(ids):
    return [name(i) for i in ids]


def sport_table(sport):
    t = collections.defaultdict(lambda: [0, 0, 0])
    for k in CONTESTS:
        if k["sport"] != sport:
            continue
        for e in k["entries"]:
            if e.get("award") in AWARDS:
                t[entry_group(e)][AWARDS.index(e["award"])] += 1
    return t


def sport_leader(sport):
    t = sport_table(sport)
    best = max(tuple(v) for v in t.values())
    return [gname(g) for g, v in t.items() if tuple(v) == best]


def overall_leader_if_wrong_for(sport):
    lead = gname(table_order()[0])
    return [lead] if lead not in sport_leader(sport) else []


def group_sport_golds(g, sport):
    return sport_table(sport)[g][0]


def heats_best(category):
    ids = [MH1, MH2] if category == "men" else [WH1, WH2]
    marks = [e["mark"] for i in ids for e in placed(KM[i])]
    return fmt_mark(KM[ids[0]], min(marks, key=secs))


# ---------------------------------------------------------------- singles
SINGLES = [
    # --- podium / winners
    T("who won the mens 100m final", "podium", {"contest": M100}, "who", ["missing_apostrophe"], what="winner"),
    T("Quick one: who took gold, silver and bronze in the women's javelin?", "podium",
      {"contest": WJAV}, "results", ["chatty"]),
    T("podium for the 1500 metres, men", "podium", {"contest": M1500}, "results", ["terse"]),
    T("who won the womens road race", "podium", {"contest": CWRR}, "who", ["missing_apostrophe"], what="winner"),
    T("which team won the men's gold-medal game in basketball", "podium", {"contest": BM}, "who", ["exact"],
      what="winner"),
    T("winner of heat two of the womens 100?", "podium", {"contest": WH2}, "who",
      ["number_words", "constraint"], what="winner"),
    T("who won the men's 800 metres", "podium", {}, "who", ["no_such_event"], outcome="no_data",
      never=winner(M400) + winner(M1500)),
    T("who won the womens shot put", "podium", {}, "who", ["no_such_event"], outcome="no_data",
      never=winner(WJAV)),
    T("who won the javelin tonight", "podium", {"contest": MJAV}, "who",
      ["relative_day", "constraint", "live"], what="winner"),
    T("who won the mans flaw final", "podium", {"contest": GMFL}, "who", ["voice", "mishearing"], what="winner"),
    T("ladies time trial winner?", "podium", {"contest": CWTT}, "who", ["terse"], what="winner"),
    T("who won the men's sprint final", "podium", {"contest": M100}, "who", ["alias"], what="winner"),
    T("did anybody beat the quay rocket in the 200", "competitor_result", {"competitor": GALKACE, "contest": M200},
      "whether", ["alias", "voice"], what="place"),
    T("who won the 400 im for the women", "podium", {"contest": SWIM}, "who", ["abbreviation", "scheduled"],
      what="winner"),
    T("who took the men's 200m butterfly", "podium", {"contest": SMFLY}, "who", [], what="winner"),
    T("who won the mens triathlon", "podium", {}, "who", ["no_such_event"], outcome="no_data"),
    T("wich guy won the 400 metres mens", "podium", {"contest": M400}, "who", ["misspelling"], what="winner"),

    # --- medalist
    T("who got silver in the 400m women", "medalist", {"contest": W400, "award": "silver"}, "who", []),
    T("bronze in the mens long jump?", "medalist", {"contest": MLJ, "award": "bronze"}, "who", ["terse"]),
    T("who came third in the women's floor final", "medalist", {"contest": GWFL, "award": "bronze"}, "who",
      ["number_words"]),
    T("who finished second in the mens all around", "medalist", {"contest": GMAA, "award": "silver"}, "who",
      ["number_words"]),
    T("who got the silver medal in the women's 200 free", "medalist", {"contest": SWF200, "award": "silver"},
      "who", ["tie"]),
    T("who got gold in the single sculls for men", "medalist", {"contest": RMS, "award": "gold"}, "who", []),
    T("who got bronze in the metric mile for women", "medalist", {"contest": W1500, "award": "bronze"}, "who",
      ["voice", "alias"]),
    T("runner up in the 100 breast men?", "medalist", {"contest": SMBR, "award": "silver"}, "who",
      ["abbreviation", "terse"]),
    T("which country got bronze in the men's double sculls", "medalist", {"contest": RMD, "award": "bronze"},
      "who", ["team_event"]),
    T("who won silver in the womens 200 metres", "medalist", {"contest": W200, "award": "silver"}, "who",
      ["missing_apostrophe"]),

    # --- full results
    T("full results mens 200m", "full_results", {"contest": M200}, "results", ["terse"]),
    T("top five in the womens marathon please", "full_results", {"contest": WMAR, "count": "5"}, "results",
      ["number_words"]),
    T("results of the men's road race", "full_results", {"contest": CMRR}, "results", []),
    T("top 3 in heat 1 of the mens 100", "full_results", {"contest": MH1, "count": "3"}, "results",
      ["constraint"]),
    T("show me the full leaderboard for the women's all-around", "full_results", {"contest": GWAA}, "results",
      ["live"]),
    T("give me the first eight in the women's road race", "full_results", {"contest": CWRR, "count": "8"},
      "results", ["number_words"]),
    T("results for the men's vault", "full_results", {"contest": GMV}, "results", ["scheduled"]),
    T("can i see the mens 100 freestyle final standings", "full_results", {"contest": SMF100}, "results", []),
    T("women's 1500 top ten", "full_results", {"contest": W1500, "count": "10"}, "results", ["terse"]),

    # --- live leader
    T("who's leading the men's marathon", "live_leader", {"contest": MMAR}, "who", ["contraction", "live"]),
    T("whos ahead in the javelin rn", "live_leader", {"contest": MJAV}, "who",
      ["abbreviation", "missing_apostrophe", "live"]),
    T("high jump leader?", "live_leader", {"contest": MHJ}, "who", ["terse", "live"]),
    T("who's in front in the women's all around and by how much", "live_leader", {"contest": GWAA}, "margin",
      ["live"]),
    T("who's leading the women's sprint final", "live_leader", {"contest": W100}, "who", ["alias", "scheduled"]),

    # --- best mark
    T("fastest 100m time at these games for the men?", "best_mark",
      {"discipline": "athletics/100m", "category": "men"}, "mark", []),
    T("what's the longest women's long jump so far", "best_mark",
      {"discipline": "athletics/long-jump", "category": "women"}, "mark", ["contraction"]),
    T("best javelin throw by a woman", "best_mark", {"discipline": "athletics/javelin", "category": "women"},
      "mark", []),
    T("quickest womens 100 metres run so far", "best_mark", {"discipline": "athletics/100m", "category": "women"},
      "mark", ["tie"]),
    T("top score on floor for the men", "best_mark", {"discipline": "gymnastics/floor", "category": "men"},
      "mark", []),
    T("best time in the 1500", "best_mark", {"discipline": "athletics/1500m"}, "mark", ["missing_slot"]),
    T("fastest 400 im by a man?", "best_mark",
      {"discipline": "swimming/400m-individual-medley", "category": "men"}, "mark", ["abbreviation"]),
    T("whats the best all around score for the guys", "best_mark",
      {"discipline": "gymnastics/all-around", "category": "men"}, "mark", ["missing_apostrophe"]),
    T("quickest 200 fly by a woman this week", "best_mark",
      {"discipline": "swimming/200m-butterfly", "category": "women"}, "mark", ["abbreviation"]),

    # --- competitor medals
    T("how many medals has Hothic Nuvasko got", "competitor_medals", {"competitor": P("Hothic Nuvasko")}, "count",
      ["exact"]),
    T("how many golds does galkace have", "competitor_medals", {"competitor": GALKACE}, "count",
      ["partial", "lowercase"], what="gold"),
    T("big tobi medals?", "competitor_medals", {"competitor": P("Tobiah Dünmark")}, "count",
      ["alias", "team_event"], what="kinds"),
    T("Lirust Dosavorn medal tally", "competitor_medals", {"competitor": P("Lirust Dosavorn")}, "count", []),
    T("did Hulek Dorrago get any medals?", "competitor_medals", {"competitor": DORRAGO}, "whether", [],
      what="kinds"),
    T("how many medals has Trulorin Hinell won", "competitor_medals", {"competitor": P("Trulorin Hinell")}, "count",
      ["zero"]),
    T("renee ostravin how many medals", "competitor_medals", {"competitor": P("Renée Ostravin")}, "count",
      ["diacritics"]),
    T("medals for merrel vareroy?", "competitor_medals", {"competitor": P("Merrel Vareroy")}, "count",
      ["team_event"], what="kinds"),

    # --- competitor next
    T("when does anais cordvelle run next", "competitor_next", {"competitor": P("Anaïs Cordvelle")}, "when",
      ["diacritics"]),
    T("next race for Velach Mesoss?", "competitor_next", {"competitor": P("Velach Mesoss")}, "when", []),
    T("when do we next see gerira gumarace on the track", "competitor_next", {"competitor": P("Gerira Gumarace")},
      "when", []),
    T("next event for Tenora Terrdal", "competitor_next", {"competitor": P("Tenora Terrdal")}, "when", []),
    T("when is nisette kralkayne in the water again", "competitor_next", {"competitor": P("Nisette Kralkayne")},
      "when", []),
    T("is Bana Gulelick racing again", "competitor_next", {"competitor": P("Bana Gulelick")}, "when", ["whether"]),
    T("when does Issov Fustisessi swim next", "competitor_next", {"competitor": P("Issov Fustisessi")}, "when",
      ["nothing_left"]),

    # --- profile
    T("how are the games going for Onov Sarromell", "competitor_profile", {"competitor": P("Onov Sarromell")},
      "profile", []),
    T("tell me about Tetha Brelwick", "competitor_profile", {"competitor": P("Tetha Brelwick")}, "profile", []),
    T("rundown on hulek dorragos games so far", "competitor_profile", {"competitor": DORRAGO}, "profile",
      ["missing_apostrophe"]),
    T("what's Stemelle Kovendal done so far", "competitor_profile", {"competitor": P("Stemelle Kovendal")},
      "profile", ["contraction"]),
    T("how has Bandan Zorvren got on this week", "competitor_profile", {"competitor": P("Bandan Zorvren")},
      "profile", []),
    T("guvisse tostanayne results", "competitor_profile", {"competitor": P("Guvisse Tostanayne")}, "profile",
      ["terse"]),

    # --- competitor result
    T("how did galkace do in the 200", "competitor_result", {"competitor": GALKACE, "contest": M200}, "how_did",
      ["partial"]),
    T("where did Jorund Halmvik finish in the 100 free", "competitor_result",
      {"competitor": P("Jørund Halmvik"), "contest": SMF100}, "how_did", ["diacritics", "abbreviation"]),
    T("how did Anais Cordvelle go in her heat", "competitor_result",
      {"competitor": P("Anaïs Cordvelle"), "contest": WH1}, "how_did", ["diacritics", "constraint"]),
    T("what was Bedald Tharvane's jump", "competitor_result", {"competitor": P("Bedald Tharvane")}, "mark", [],
      what="mark"),
    T("how's lomov kerreth doing in the high jump", "competitor_result",
      {"competitor": P("Lomov Kerreth"), "contest": MHJ}, "how_did", ["live", "contraction"]),
    T("did Zosard Krurvasko finish the 1500", "competitor_result",
      {"competitor": P("Zosard Krurvasko"), "contest": M1500}, "whether", ["dns"],
      never=[ordinal(n) for n in range(1, 10)]),
    T("cidys cusolick marathon result", "competitor_result", {"competitor": P("Cidys Cusolick"), "contest": WMAR},
      "how_did", ["dnf", "terse"], never=["10th"]),
    T("how did galkace do in the 400", "competitor_result", {"competitor": GALKACE, "contest": M400}, "how_did",
      ["not_entered"], never=[fmt_mark(KM[M400], at_place(KM[M400], 1)[0]["mark"])]),
    T("what time did Thorust Fuswick run", "competitor_result", {"competitor": P("Thorust Fuswick")}, "mark", [],
      what="mark"),
    T("how did Krarrek Cedell get on in the javelin", "competitor_result",
      {"competitor": P("Krarrek Cedell"), "contest": MJAV}, "how_did", ["live"]),
    T("where did Mårten Quellby place on the floor", "competitor_result",
      {"competitor": P("Mårten Quellby"), "contest": GMFL}, "how_did", ["diacritics_kept"]),
    T("how did Iñigo Saltreva do", "competitor_result", {"competitor": P("Iñigo Saltreva")}, "how_did",
      ["live", "missing_slot"]),
    T("what was Sondora Hervoveths winning jump", "competitor_result",
      {"competitor": P("Sondora Hervoveth"), "contest": WLJ}, "mark", ["missing_apostrophe"], what="mark"),

    # --- contest time / place
    T("when is the women's 100 metres final", "contest_time", {"contest": W100}, "when", ["exact"]),
    T("what time does the women's 400 IM start tomorrow", "contest_time", {"contest": SWIM}, "when",
      ["relative_day", "abbreviation"], what="when"),
    T("where is the men's time trial", "contest_time", {"contest": CMTT}, "where", [], what="where"),
    T("whens the womens basketball final", "contest_time", {"contest": BW}, "when", ["missing_apostrophe"]),
    T("where's the rowing double sculls for women being held", "contest_time", {"contest": RWD}, "where", [],
      what="where"),
    T("what time did the men's marathon start", "contest_time", {"contest": MMAR}, "when", ["live"],
      what="when"),
    T("where was the men's road race", "contest_time", {"contest": CMRR}, "where", ["no_venue"], what="where"),
    T("when is the womens high jump", "contest_time", {"contest": WHJ}, "when", ["missing_apostrophe"]),
    T("what time is the men's 4x100 relay", "contest_time", {}, "when", ["no_such_event"], outcome="no_data"),
    T("when does heat 3 of the women's 100 start", "contest_time", {}, "when", ["no_such_event", "constraint"],
      outcome="no_data", never=[hhmm(KM[WH1]), hhmm(KM[WH2])]),
    T("when was the men's 400 final", "contest_time", {"contest": M400}, "when", ["past"], what="when"),

    # --- delegation in event
    T("how did kalvenmark do in the men's 100m", "delegation_in_event", {"group": "kalvenmark", "contest": M100},
      "how_did", []),
    T("how did Orrindel get on in the mens basketball", "delegation_in_event",
      {"group": "orrindel", "contest": BM}, "how_did", ["alias", "team_event"]),
    T("did Team Vastrelia have anyone in the women's marathon", "delegation_in_event",
      {"group": "vastrelia", "contest": WMAR}, "how_did", ["alias"]),
    T("Brellmoor in the women's 1500?", "delegation_in_event", {"group": "brellmoor", "contest": W1500},
      "how_did", ["terse"]),
    T("how did zandrel do in the mens 200", "delegation_in_event", {"group": "zandrel", "contest": M200},
      "how_did", ["alias", "lowercase"]),
    T("how did Estravane do in the women's floor", "delegation_in_event", {"group": "estravane", "contest": GWFL},
      "how_did", ["not_entered"]),
    T("how is halvorne doing in the javelin", "delegation_in_event", {"group": "halvorne", "contest": MJAV},
      "how_did", ["live"]),
    T("corvanthe result in the mens high jump", "delegation_in_event", {"group": "corvanthe", "contest": MHJ},
      "how_did", ["live", "terse"]),

    # --- delegation medals
    T("how many medals has Quessary won", "delegation_medals", {"group": "quessary"}, "count", ["exact", "tie"]),
    T("where are Dunmerrow in the medal table", "delegation_medals", {"group": "dunmerrow"}, "rank", [],
      what="rank"),
    T("how many golds for kalvenmark", "delegation_medals", {"group": "kalvenmark"}, "count", [], what="gold"),
    T("medals for QVS", "delegation_medals", {"group": "vastrelia"}, "count", ["code"]),
    T("estravane medal count", "delegation_medals", {"group": "estravane"}, "count", ["zero", "terse"]),
    T("how many medals do the Tolmerin team have", "delegation_medals", {"group": "tolmerin"}, "count",
      ["alias"]),
    T("halvorne golds?", "delegation_medals", {"group": "halvorne"}, "count", ["terse"], what="gold"),
    T("how's myrhaven doing for medals", "delegation_medals", {"group": "myrrhaven"}, "count",
      ["misspelling", "contraction"]),

    # --- medal table
    T("who's top of the medal table", "medal_table_leader", {}, "who", ["contraction"]),
    T("which nation is winning the games overall", "medal_table_leader", {}, "who", []),
    T("show me the medal table", "medal_table_top", {}, "table", []),
    T("top five in the medal standings", "medal_table_top", {"count": "5"}, "table", ["number_words"]),
    T("who has the most medals of any delegation, all colours", "most_medals", {}, "who", ["tie"]),
    T("biggest medal haul so far?", "most_medals", {}, "who", ["terse", "tie"]),

    # --- schedule
    T("what's on tomorrow", "schedule_day", {"date": D_TOM}, "schedule", ["relative_day"]),
    T("any swimming on monday", "schedule_day", {"date": "2027-08-16", "sport": "swimming"}, "schedule",
      ["constraint"]),
    T("what's happening today", "schedule_day", {"date": D_TODAY}, "schedule", ["relative_day"]),
    T("what gymnastics was on yesterday", "schedule_day", {"date": D_YEST, "sport": "gymnastics"}, "schedule",
      ["relative_day", "constraint"]),
    T("schedule for the 17th", "schedule_day", {"date": "2027-08-17"}, "schedule", ["terse"]),
    T("is there any track and field tomorrow", "schedule_day", {"date": D_TOM, "sport": "athletics"},
      "schedule", ["alias", "relative_day", "constraint"]),
    T("anything on wednesday the 18th", "schedule_day", {"date": "2027-08-18"}, "schedule", []),
    T("cycling today?", "schedule_day", {"date": D_TODAY, "sport": "cycling"}, "schedule",
      ["relative_day", "constraint", "terse"]),
    T("what was on on the tenth", "schedule_day", {"date": "2027-08-10"}, "schedule", ["number_words"]),

    # --- under way
    T("what's on right now", "under_way", {}, "schedule", ["contraction"]),
    T("any gymnastics going on at the moment", "under_way", {"sport": "gymnastics"}, "schedule", ["constraint"]),
    T("is there swimming live now", "under_way", {"sport": "swimming"}, "schedule", ["constraint"]),

    # --- head to head
    T("who finished higher in the 100 final, Dorrago or Tollevant", "head_to_head",
      {"competitor": DORRAGO, "rival": P("Émeric Tollevant"), "contest": M100}, "compare", ["partial"]),
    T("was renee ostravin ahead of suthisse dasonert in the road race", "head_to_head",
      {"competitor": P("Renée Ostravin"), "rival": P("Suthisse Dasonert"), "contest": CWRR}, "compare",
      ["diacritics"]),
    T("who did better in the time trial, tetha brelwick or furrys brelketh", "head_to_head",
      {"competitor": P("Tetha Brelwick"), "rival": P("Furrys Brelketh"), "contest": CWTT}, "compare",
      ["similar_names"]),
    T("between Issov Fustisessi and Jørund Halmvik in the 200 free, who came out on top", "head_to_head",
      {"competitor": P("Issov Fustisessi"), "rival": P("Jørund Halmvik"), "contest": SMF200}, "compare",
      ["abbreviation"]),
    T("is Korvace ahead of Cossasko in the high jump", "head_to_head",
      {"competitor": P("Vathen Korvace"), "rival": P("Thadach Cossasko"), "contest": MHJ}, "compare",
      ["partial", "live"]),
    T("did Tenora Terrdal beat Terrette Femwick on floor", "head_to_head",
      {"competitor": P("Tenora Terrdal"), "rival": P("Terrette Femwick"), "contest": GWFL}, "whether", []),

    # --- ambiguous names
    CLAR("how many medals has zoe won", "competitor_medals", {}, ppl(ZOES), "count",
         ["ambiguous", "diacritics"]),
    CLAR("how did Kovendal do", "competitor_profile", {}, ppl(KOVENDALS), "profile", ["ambiguous", "partial"]),
    CLAR("who won the marathon", "podium", {}, [], "who", ["ambiguous", "missing_slot"]),

    # --- chat
    T("hi", "greeting", {}, "chat", ["terse"]),
    T("what sort of things can I ask you?", "help", {}, "chat", []),

    # --- not understood
    N("asdfgh jkl", "other", ["gibberish"], outcome="not_understood"),
    N("can you order me a pizza", "other", ["off_topic"], outcome="not_understood"),
    N("what's the capital of portugal", "other", ["off_topic"], outcome="not_understood"),

    # --- uncovered
    N("what's the weather going to be like for the women's 100 final tomorrow", "other", ["relative_day"]),
    N("who qualified for the women's 100 final from heat 1", "other", ["constraint"]),
    N("how old is Wonorin Galkace", "other", []),
    N("what's the world record in the men's 100m", "mark", [], never=[fmt_mark(KM[M100], "9.84")]),
    N("which channel is showing the high jump", "other", []),
    N("where can i buy tickets for the women's basketball final", "other", []),
    N("who came fifth in the men's 100", "who", ["constraint", "number_words"], never=winner(M100)),
    N("who finished fourth in the women's long jump", "who", ["constraint", "number_words"],
      never=winner(WLJ)),
    N("who leads the swimming medal table", "table", ["constraint"], never=overall_leader_if_wrong_for("swimming")),
    N("how many golds has kalvenmark won in athletics", "count", ["constraint"],
      never=[count_word(TABLE["kalvenmark"][0])]
      if group_sport_golds("kalvenmark", "athletics") != TABLE["kalvenmark"][0] else []),
    N("how many medals did Quessary win yesterday", "count", ["constraint", "relative_day"],
      never=[str(sum(TABLE["quessary"]))]),
    N("what was the fastest time in the men's 100 heats", "mark", ["constraint"],
      never=[fmt_mark(KM[M100], "9.84")] if heats_best("men") != "9.84 s" else []),
    N("what's on at tidewell tomorrow", "schedule", ["constraint", "relative_day"],
      never=[hhmm(k) for k in CONTESTS if k["start"][:10] == D_TOM and k.get("venue") != "Tidewell Aquatic Centre"]),
    N("what's happening at the stadium right now", "schedule", ["constraint"],
      never=sorted({DISC[f'{k["sport"]}/{k["discipline"]}']["name"] for k in CONTESTS
                    if k["status"] == "live" and k.get("venue") != "Lowenfirth Coast Stadium"})),
    N("how did Brellmoor do in the swimming overall", "how_did", ["constraint"]),
    N("who's the flag bearer for orrindel", "other", []),
    N("whats galkaces personal best in the 100", "mark", ["missing_apostrophe"]),
    N("how tall is lomov kerreth", "other", []),
    N("who coaches tetha brelwick", "other", []),
    N("what was the wind reading in the men's 100 final", "other", []),
    N("how many athletes are competing at the games", "count", []),
    N("how much prize money do you get for a gold", "other", []),
    N("which athlete has won the most golds", "who", []),
    N("how many medal events are still to be decided", "open", []),
    N("which finals haven't started yet", "open", ["contraction"]),
    N("what were the splits at halfway in the men's marathon", "other", ["live"]),
    N("who is the youngest medallist of the games", "who", []),
    N("which delegation has the most bronze medals", "who", ["constraint"]),
    N("who came last in the women's road race", "who", ["constraint"], never=winner(CWRR)),
    N("who's fourth in the marathon right now", "who", ["constraint", "live"], never=names_at(MMAR, 1)),
    N("how many countries have won at least one gold", "count", []),
    N("has anyone broken a games record", "whether", []),
    N("is there a minute's silence before the basketball final", "other", []),
    N("how many medals has Halvorne won in the pool", "count", ["constraint"],
      never=[count_word(sum(TABLE["halvorne"]))]),
    N("what's kalvenmark's place in the rowing medal table", "rank", ["constraint"]),
]

# ---------------------------------------------------------------- conversations
CONVS = [
    CONV(["follow_up", "pronoun", "thanks_between"],
         T("hi there", "greeting", {}, "chat", ["chatty"]),
         T("who won the mens 100 metres", "podium", {"contest": M100}, "who", [], what="winner"),
         T("and the 200?", "podium", {"contest": M200}, "who", ["follow_up", "ellipsis"], what="winner"),
         T("what time did he run in that one", "competitor_result", {"competitor": GALKACE, "contest": M200},
           "mark", ["follow_up", "pronoun"], what="mark"),
         T("thanks!", "thanks", {}, "chat", [])),
    CONV(["ambiguous", "clarify", "follow_up"],
         CLAR("how many medals has zoe quillon... no wait, i mean zoe, the one everyone's talking about",
              "competitor_medals", {}, ppl(ZOES), "count", ["ambiguous", "chatty"]),
         T("the swimmer", "competitor_medals", {"competitor": ZOES[0]}, "count", ["follow_up", "clarify_answer"]),
         T("when is she in the pool next", "competitor_next", {"competitor": ZOES[0]}, "when",
           ["follow_up", "pronoun"]),
         T("where is that", "contest_time", {"contest": SWIM}, "where", ["follow_up", "pronoun"], what="where")),
    CONV(["ambiguous", "clarify", "follow_up"],
         CLAR("how did kovendal do in the final", "competitor_result", {}, ppl(KOVENDALS), "how_did",
              ["ambiguous", "partial"]),
         T("the rower", "competitor_result", {"competitor": KOVENDALS[0], "contest": RMS}, "how_did",
           ["follow_up", "clarify_answer"]),
         T("and the other one in the breaststroke?", "competitor_result",
           {"competitor": KOVENDALS[1], "contest": SWBR}, "how_did", ["follow_up", "pronoun"])),
    CONV(["follow_up", "pronoun"],
         T("whos top of the medal table at the moment", "medal_table_leader", {}, "who",
           ["missing_apostrophe"]),
         T("how many golds have they got", "delegation_medals", {"group": "kalvenmark"}, "count",
           ["follow_up", "pronoun"], what="gold"),
         T("and where's Vastrelia", "delegation_medals", {"group": "vastrelia"}, "rank", ["follow_up"],
           what="rank"),
         T("top five please", "medal_table_top", {"count": "5"}, "table", ["follow_up", "number_words"])),
    CONV(["follow_up", "live"],
         T("who's leading the men's marathon right now", "live_leader", {"contest": MMAR}, "who", ["live"],
           what="leader"),
         T("by how much", "live_leader", {"contest": MMAR}, "margin", ["follow_up", "ellipsis"], what="margin"),
         N("and who's third", "who", ["follow_up", "constraint"], never=names_at(MMAR, 1)),
         T("when did it start", "contest_time", {"contest": MMAR}, "when", ["follow_up", "pronoun"],
           what="when"),
         T("how's the Welkmarsh runner doing", "delegation_in_event", {"group": "welkmarsh", "contest": MMAR},
           "how_did", ["follow_up"])),
    CONV(["follow_up", "relative_day"],
         T("what's on tomorrow?", "schedule_day", {"date": D_TOM}, "schedule", ["relative_day"]),
         T("anything in the pool?", "schedule_day", {"date": D_TOM, "sport": "swimming"}, "schedule",
           ["follow_up", "constraint"]),
         N("who's swimming in it", "other", ["follow_up", "start_list"]),
         T("ok what about the day after", "schedule_day", {"date": "2027-08-16"}, "schedule",
           ["follow_up", "relative_day"])),
    CONV(["voice", "follow_up", "pronoun"],
         T("who won the woman's long jump", "podium", {"contest": WLJ}, "who", ["voice", "mishearing"],
           what="winner"),
         T("how far did she jump", "competitor_result", {"competitor": P("Sondora Hervoveth"), "contest": WLJ},
           "mark", ["follow_up", "pronoun", "voice"], what="mark"),
         T("who got silver", "medalist", {"contest": WLJ, "award": "silver"}, "who", ["follow_up", "voice"]),
         N("by how much did she miss out on gold", "margin", ["follow_up", "pronoun", "voice"])),
    CONV(["new_question"],
         T("what can you do", "help", {}, "chat", []),
         T("ok then which country has won the most medals", "most_medals", {}, "who", ["new_question", "tie"]),
         T("and golds?", "medal_table_leader", {}, "who", ["follow_up", "ellipsis"])),
    CONV(["follow_up", "pronoun", "diacritics"],
         T("when does anais cordvelle race next", "competitor_next", {"competitor": P("Anaïs Cordvelle")},
           "when", ["diacritics"]),
         T("how did she do in the heats", "competitor_result", {"competitor": P("Anaïs Cordvelle"),
                                                               "contest": WH1}, "how_did",
           ["follow_up", "pronoun", "constraint"]),
         T("and who won the other heat", "podium", {"contest": WH2}, "who", ["follow_up"], what="winner"),
         T("whats the fastest time of the lot so far", "best_mark",
           {"discipline": "athletics/100m", "category": "women"}, "mark", ["follow_up", "tie"])),
    CONV(["follow_up", "thanks_between"],
         T("how did Sordavia do in the women's long jump", "delegation_in_event",
           {"group": "sordavia", "contest": WLJ}, "how_did", []),
         T("and the men's?", "delegation_in_event", {"group": "sordavia", "contest": MLJ}, "how_did",
           ["follow_up", "ellipsis"]),
         T("what about in the 1500 men", "delegation_in_event", {"group": "sordavia", "contest": M1500},
           "how_did", ["follow_up", "dns"], never=[ordinal(n) for n in range(1, 10)]),
         T("thanks a lot", "thanks", {}, "chat", [])),
    CONV(["follow_up", "team_event"],
         T("who won the men's basketball final", "podium", {"contest": BM}, "who", ["team_event"],
           what="winner"),
         T("what was the score", "full_results", {"contest": BM, "count": "2"}, "mark", ["follow_up"],
           what="mark"),
         T("and when's the women's final", "contest_time", {"contest": BW}, "when", ["follow_up"]),
         T("big tobi, how many medals does he have", "competitor_medals", {"competitor": P("Tobiah Dünmark")},
           "count", ["new_question", "alias"], what="kinds")),
    CONV(["follow_up", "constraint"],
         T("did Dorrago beat Galkace in their heat", "head_to_head",
           {"competitor": DORRAGO, "rival": GALKACE, "contest": MH1}, "compare", ["partial", "constraint"]),
         T("and in the final?", "head_to_head", {"competitor": DORRAGO, "rival": GALKACE, "contest": M100},
           "compare", ["follow_up", "ellipsis"]),
         T("where did dorrago end up in the final", "competitor_result", {"competitor": DORRAGO, "contest": M100},
           "how_did", ["follow_up"]),
         T("who got the bronze", "medalist", {"contest": M100, "award": "bronze"}, "who", ["follow_up"])),
    CONV(["follow_up", "pronoun", "live"],
         T("any gymnastics on now", "under_way", {"sport": "gymnastics"}, "schedule", ["constraint"]),
         T("who's winning it", "live_leader", {"contest": GWAA}, "who", ["follow_up", "pronoun"]),
         T("didn't she get a medal on floor?", "competitor_result",
           {"competitor": P("Krundena Dovonasko"), "contest": GWFL}, "whether", ["follow_up", "pronoun"],
           what="place"),
         T("when's her next event after this one", "competitor_next", {"competitor": P("Krundena Dovonasko")},
           "when", ["follow_up", "pronoun"])),
    CONV(["follow_up", "pronoun"],
         T("who won the women's time trial", "podium", {"contest": CWTT}, "who", [], what="winner"),
         T("has she won anything else", "competitor_medals", {"competitor": P("Tetha Brelwick")}, "count",
           ["follow_up", "pronoun"]),
         T("when does the men's TT take place", "contest_time", {"contest": CMTT}, "when",
           ["new_question", "abbreviation"]),
         N("who's the favourite for that", "other", ["follow_up", "pronoun"])),
    CONV(["misspelling", "follow_up"],
         T("medals for brelmoor?", "delegation_medals", {"group": "brellmoor"}, "count", ["misspelling", "tie"]),
         T("how did they do in the double scull", "delegation_in_event", {"group": "brellmoor", "contest": RMD},
           "how_did", ["follow_up", "pronoun", "team_event"]),
         T("and who got silver there", "medalist", {"contest": RMD, "award": "silver"}, "who",
           ["follow_up", "team_event"])),
    CONV(["follow_up", "pronoun"],
         T("who won the womens marathon", "podium", {"contest": WMAR}, "who", ["missing_apostrophe"],
           what="winner"),
         T("what was her time", "competitor_result", {"competitor": P("Trema Zulren"), "contest": WMAR}, "mark",
           ["follow_up", "pronoun"], what="mark"),
         T("who was second", "medalist", {"contest": WMAR, "award": "silver"}, "who",
           ["follow_up", "number_words"]),
         N("and the men's race, when is it expected to finish", "when", ["follow_up", "live"])),
    CONV(["relative_day", "follow_up"],
         T("what athletics was on yesterday", "schedule_day", {"date": D_YEST, "sport": "athletics"},
           "schedule", ["relative_day", "constraint"]),
         T("who won the last one", "podium", {"contest": M100}, "who", ["follow_up"], what="winner"),
         T("and the 1500", "podium", {"contest": M1500}, "who", ["follow_up", "ellipsis"], what="winner")),
    CONV(["new_question", "thanks_between"],
         T("hello!", "greeting", {}, "chat", []),
         T("whats going on in athletics right now", "under_way", {"sport": "athletics"}, "schedule",
           ["constraint", "missing_apostrophe"]),
         T("who leads the javelin", "live_leader", {"contest": MJAV}, "who", ["follow_up"]),
         T("and what's the best throw in the women's event", "best_mark",
           {"discipline": "athletics/javelin", "category": "women"}, "mark", ["follow_up"]),
         T("cheers", "thanks", {}, "chat", [])),
    CONV(["follow_up", "pronoun"],
         T("results of the women's single sculls", "full_results", {"contest": RWS}, "results", []),
         T("how did the Orrindel Isles rower go", "delegation_in_event", {"group": "orrindel", "contest": RWS},
           "how_did", ["follow_up"]),
         T("what was her time", "competitor_result", {"competitor": P("Ronira Wurosasko"), "contest": RWS},
           "mark", ["follow_up", "pronoun"], what="mark"),
         T("when's the women's double sculls", "contest_time", {"contest": RWD}, "when", ["new_question"])),
    CONV(["follow_up", "pronoun"],
         T("give me a rundown of Hothic Nuvasko's games", "competitor_profile",
           {"competitor": P("Hothic Nuvasko")}, "profile", []),
         T("how many medals is that", "competitor_medals", {"competitor": P("Hothic Nuvasko")}, "count",
           ["follow_up"]),
         T("did he beat Zemim Guntasand in the butterfly", "head_to_head",
           {"competitor": P("Hothic Nuvasko"), "rival": P("Zemim Guntasand"), "contest": SMFLY}, "whether",
           ["follow_up", "pronoun"]),
         T("what country is Guntasand from", None if False else "competitor_profile",
           {"competitor": P("Zemim Guntasand")}, "group_of", ["follow_up", "partial"],
           says=[gname(CM[P("Zemim Guntasand")]["group"])])),
    CONV(["ambiguous", "clarify", "follow_up"],
         CLAR("who won the 100m", "podium", {}, [], "who", ["ambiguous", "missing_slot"]),
         T("women", "podium", {"contest": W100}, "who", ["follow_up", "clarify_answer", "scheduled"],
           what="winner"),
         T("ok when is it", "contest_time", {"contest": W100}, "when", ["follow_up", "pronoun"])),
    CONV(["code", "follow_up"],
         T("QKV medals", "delegation_medals", {"group": "kalvenmark"}, "count", ["code", "terse"]),
         T("and QOI?", "delegation_medals", {"group": "orrindel"}, "count", ["code", "follow_up", "ellipsis"]),
         T("how about zandrel", "delegation_medals", {"group": "zandrel"}, "count", ["follow_up", "alias"])),
    CONV(["follow_up"],
         T("when does Gedora Vilell ride next", "competitor_next", {"competitor": P("Gedora Vilell")}, "when",
           ["nothing_left"]),
         T("ok what about Dundust Tentovar", "competitor_next", {"competitor": P("Dundust Tentovar")}, "when",
           ["follow_up"]),
         T("where's that race", "contest_time", {"contest": CMTT}, "where", ["follow_up", "pronoun"],
           what="where")),
    CONV(["voice", "relative_day", "follow_up"],
         T("what's on on sunday", "schedule_day", {"date": D_TOM}, "schedule", ["voice", "relative_day"]),
         T("what about tuesday", "schedule_day", {"date": "2027-08-17"}, "schedule",
           ["follow_up", "voice", "relative_day"]),
         T("and wednesday", "schedule_day", {"date": "2027-08-18"}, "schedule",
           ["follow_up", "voice", "ellipsis"])),
    CONV(["follow_up", "ellipsis"],
         T("what's the fastest 200 metres by a woman at these games", "best_mark",
           {"discipline": "athletics/200m", "category": "women"}, "mark", []),
         T("and by a man", "best_mark", {"discipline": "athletics/200m", "category": "men"}, "mark",
           ["follow_up", "ellipsis"]),
         N("and who has the second best", "who", ["follow_up", "constraint"])),
    CONV(["follow_up", "not_entered"],
         T("who came out ahead in the road race, Suthisse Dasonert or Stavette Hestane", "head_to_head",
           {"competitor": P("Suthisse Dasonert"), "rival": P("Stavette Hestane"), "contest": CWRR}, "compare",
           []),
         T("what about in the time trial", "head_to_head",
           {"competitor": P("Suthisse Dasonert"), "rival": P("Stavette Hestane"), "contest": CWTT}, "compare",
           ["follow_up", "not_entered"]),
         T("how did Dasonert do in that one", "competitor_result",
           {"competitor": P("Suthisse Dasonert"), "contest": CWTT}, "how_did", ["follow_up", "partial"])),
    CONV(["uncovered", "follow_up"],
         N("how old is Lirust Dosavorn", "other", []),
         T("ok how did he do in the 100 final", "competitor_result",
           {"competitor": P("Lirust Dosavorn"), "contest": M100}, "how_did", ["follow_up", "pronoun"]),
         N("is that a personal best for him", "whether", ["follow_up", "pronoun"])),
    CONV(["thanks_between", "follow_up"],
         T("who won gold in the men's all around", "medalist", {"contest": GMAA, "award": "gold"}, "who", []),
         T("thank you", "thanks", {}, "chat", []),
         T("and who's leading the women's all around", "live_leader", {"contest": GWAA}, "who",
           ["follow_up", "live"], what="leader"),
         T("is Zoë Tassevar in the mix", "competitor_result", {"competitor": ZOES[2], "contest": GWAA},
           "how_did", ["follow_up", "live"])),
    CONV(["ambiguous", "constraint", "follow_up"],
         T("hows zoe doing in the all around", "competitor_result", {"competitor": ZOES[2], "contest": GWAA},
           "how_did", ["ambiguous", "constraint", "live", "missing_apostrophe"]),
         T("when does she compete next", "competitor_next", {"competitor": ZOES[2]}, "when",
           ["follow_up", "pronoun"]),
         T("where", "contest_time", {"contest": GWV}, "where", ["follow_up", "ellipsis", "terse"], what="where")),
    CONV(["alias", "follow_up"],
         T("how's jory done at these games", "competitor_profile", {"competitor": P("Jørund Halmvik")},
           "profile", ["alias", "contraction"]),
         T("did he medal", "competitor_medals", {"competitor": P("Jørund Halmvik")}, "whether",
           ["follow_up", "pronoun"], what="kinds"),
         T("who beat him in the 200 free", "podium", {"contest": SMF200}, "who", ["follow_up", "pronoun"],
           what="winner")),
    CONV(["zero", "follow_up"],
         T("how many medals does welkmarsh have", "delegation_medals", {"group": "welkmarsh"}, "count",
           ["zero"]),
         N("what's their best result then", "how_did", ["follow_up", "pronoun"]),
         T("how did they do in the basketball", "delegation_in_event", {"group": "welkmarsh", "contest": BM},
           "how_did", ["follow_up", "pronoun", "team_event"])),
    CONV(["follow_up", "where"],
         N("where's the gymnastics held", "where", []),
         T("when's the men's vault", "contest_time", {"contest": GMV}, "when", ["follow_up"]),
         N("who's in it", "other", ["follow_up", "pronoun", "start_list"])),
    CONV(["live", "follow_up", "pronoun"],
         T("high jump standings please", "full_results", {"contest": MHJ}, "results", ["live", "terse"]),
         T("whos leading", "live_leader", {"contest": MHJ}, "who", ["follow_up", "ellipsis"]),
         T("how's the brellmoor guy doing", "delegation_in_event", {"group": "brellmoor", "contest": MHJ},
           "how_did", ["follow_up", "lowercase"]),
         T("what height has he cleared", "competitor_result",
           {"competitor": P("Thadach Cossasko"), "contest": MHJ}, "mark", ["follow_up", "pronoun"],
           what="mark")),
    CONV(["tie", "follow_up"],
         T("who won the women's 200 freestyle", "podium", {"contest": SWF200}, "results", ["tie"]),
         T("and bronze?", "medalist", {"contest": SWF200, "award": "bronze"}, "who",
           ["follow_up", "ellipsis", "tie"], outcome=None, says=[], never=names_at(SWF200, 4)),
         T("did Quillon touch ahead of Brussand", "head_to_head",
           {"competitor": ZOES[0], "rival": P("Hurra Brussand"), "contest": SWF200}, "compare",
           ["follow_up", "partial", "tie"])),
    CONV(["not_understood", "follow_up"],
         N("blorp", "other", ["gibberish"], outcome="not_understood"),
         T("sorry, meant to ask who won the men's single sculls", "podium", {"contest": RMS}, "who",
           ["chatty"], what="winner"),
         T("what time", "competitor_result", {"competitor": P("Thindust Zavindal"), "contest": RMS}, "mark",
           ["follow_up", "ellipsis"], what="mark"),
         N("how close was second", "margin", ["follow_up"])),
    CONV(["dsq", "follow_up"],
         T("women's 400 final results", "full_results", {"contest": W400}, "results", ["terse"]),
         T("what happened to Drada Brorrorn", "competitor_result",
           {"competitor": P("Drada Brorrorn"), "contest": W400}, "how_did", ["follow_up", "dsq"],
           never=["6th"]),
         T("who got bronze", "medalist", {"contest": W400, "award": "bronze"}, "who", ["follow_up"])),
    CONV(["chatty", "follow_up"],
         T("hey, my kid is obsessed with the sprinters, when's the women's sprint final?", "contest_time",
           {"contest": W100}, "when", ["chatty", "alias"]),
         T("how did Gumarace get on in her heat", "competitor_result",
           {"competitor": P("Gerira Gumarace"), "contest": WH2}, "how_did", ["follow_up", "partial"]),
         T("and in the 200?", "competitor_result", {"competitor": P("Gerira Gumarace"), "contest": W200},
           "how_did", ["follow_up", "ellipsis", "not_entered"])),
    CONV(["follow_up", "pronoun"],
         T("top 3 medal table", "medal_table_top", {"count": "3"}, "table", ["terse"]),
         T("where does Halvorne sit", "delegation_medals", {"group": "halvorne"}, "rank", ["follow_up"],
           what="rank"),
         T("how many bronzes do they have", "delegation_medals", {"group": "halvorne"}, "count",
           ["follow_up", "pronoun"], what="bronze")),
    CONV(["relative_day", "follow_up"],
         T("who won gold last night in the 1500", "podium", {"contest": M1500}, "who",
           ["relative_day", "constraint"], what="winner"),
         T("and the night before", "podium", {"contest": W1500}, "who", ["follow_up", "relative_day"],
           what="winner"),
         T("she's from where", "competitor_profile", {"competitor": P("Bronaline Hervace")}, "group_of",
           ["follow_up", "pronoun"], says=[gname(CM[P("Bronaline Hervace")]["group"])])),
    CONV(["follow_up", "scheduled"],
         N("who's swimming the men's 400 IM", "other", ["start_list"]),
         T("when is it", "contest_time", {"contest": SMIM}, "when", ["follow_up", "pronoun"])),
    CONV(["voice", "mishearing", "follow_up"],
         T("who won the javelin for women", "podium", {"contest": WJAV}, "who", ["voice"], what="winner"),
         T("how many medals has lucia wonder row won", "competitor_medals", {"competitor": P("Łucja Wenderow")},
           "count", ["voice", "mishearing", "diacritics"])),
    CONV(["follow_up", "constraint"],
         T("howd Pellavia do in the mens 100", "delegation_in_event", {"group": "pellavia", "contest": M100},
           "how_did", ["contraction", "missing_apostrophe"]),
         T("so close, who got the bronze then", "medalist", {"contest": M100, "award": "bronze"}, "who",
           ["follow_up", "chatty"]),
         N("what was the gap between them", "margin", ["follow_up", "pronoun"])),
    CONV(["follow_up", "dnf"],
         N("did everyone finish the men's road race", "status", []),
         T("who won it", "podium", {"contest": CMRR}, "who", ["follow_up", "pronoun"], what="winner"),
         T("how long did it take him", "competitor_result", {"competitor": P("Thumard Zevert"), "contest": CMRR},
           "mark", ["follow_up", "pronoun"], what="mark")),
    CONV(["compare", "follow_up"],
         T("who was quicker in the 100 free final, Muras Drenell or Krassorin Virrosand", "head_to_head",
           {"competitor": P("Muras Drenell"), "rival": P("Krassorin Virrosand"), "contest": SMF100}, "compare",
           []),
         T("and in the 200", "head_to_head",
           {"competitor": P("Muras Drenell"), "rival": P("Krassorin Virrosand"), "contest": SMF200}, "compare",
           ["follow_up", "ellipsis"])),
    CONV(["follow_up", "diacritics"],
         T("mens floor final top three", "full_results", {"contest": GMFL, "count": "3"}, "results",
           ["number_words", "terse"]),
         T("where did Marten Quellby place", "competitor_result", {"competitor": P("Mårten Quellby"),
                                                                    "contest": GMFL}, "how_did",
           ["follow_up", "diacritics"], what="place"),
         T("what's his country", "competitor_profile", {"competitor": P("Mårten Quellby")}, "group_of",
           ["follow_up", "pronoun"], says=[gname(CM[P("Mårten Quellby")]["group"])])),
    CONV(["misspelling", "follow_up"],
         T("who won the womans 1500", "podium", {"contest": W1500}, "who", ["misspelling"], what="winner"),
         T("how many medals does bronaline hervase have", "competitor_medals",
           {"competitor": P("Bronaline Hervace")}, "count", ["misspelling", "follow_up"]),
         T("and sondora hervoveth?", "competitor_medals", {"competitor": P("Sondora Hervoveth")}, "count",
           ["follow_up", "ellipsis", "similar_names"])),
    CONV(["voice", "follow_up"],
         T("who is winning the high jump", "live_leader", {"contest": MHJ}, "who", ["voice", "live"],
           what="leader"),
         T("what has he cleared", "competitor_result", {"competitor": P("Lomov Kerreth"), "contest": MHJ}, "mark",
           ["voice", "follow_up", "pronoun"], what="mark"),
         N("how many attempts has he got left", "other", ["voice", "follow_up", "pronoun"]),
         T("and the javelin", "live_leader", {"contest": MJAV}, "who", ["voice", "follow_up", "ellipsis"],
           what="leader")),
    CONV(["follow_up", "return"],
         T("how did Quessary do in the women's marathon", "delegation_in_event",
           {"group": "quessary", "contest": WMAR}, "how_did", []),
         N("how much do the marathon winners get paid", "other", ["new_question"]),
         T("ok back to quessary, how many medals overall", "delegation_medals", {"group": "quessary"}, "count",
           ["follow_up", "return"]),
         T("and their rank", "delegation_medals", {"group": "quessary"}, "rank", ["follow_up", "ellipsis"],
           what="rank")),
    CONV(["follow_up", "number_words"],
         T("give me the top four of the men's 1500", "full_results", {"contest": M1500, "count": "4"},
           "results", ["number_words"]),
         T("did Loren Vulemick beat Tremorin Bedoss", "head_to_head",
           {"competitor": P("Loren Vulemick"), "rival": P("Tremorin Bedoss"), "contest": M1500}, "whether",
           ["follow_up"]),
         N("who came seventh", "who", ["follow_up", "constraint", "number_words"], never=winner(M1500))),
    CONV(["follow_up", "team_event"],
         T("who won the men's double sculls", "podium", {"contest": RMD}, "who", ["team_event"], what="winner"),
         N("who were the two rowers in that boat", "other", ["follow_up", "pronoun", "team_event"]),
         T("merrel vareroy, how many medals", "competitor_medals", {"competitor": P("Merrel Vareroy")}, "count",
           ["follow_up", "team_event"])),
    CONV(["help", "follow_up"],
         T("help", "help", {}, "chat", ["terse"]),
         T("what's live at the moment", "under_way", {}, "schedule", ["contraction"]),
         N("and which of those will finish first", "when", ["follow_up", "pronoun"])),
    CONV(["missing_slot", "clarify", "follow_up"],
         CLAR("when is the final", "contest_time", {}, [], "when", ["missing_slot"]),
         T("the women's vault", "contest_time", {"contest": GWV}, "when", ["follow_up", "clarify_answer"]),
         T("is Krundena Dovonasko in it", "competitor_next", {"competitor": P("Krundena Dovonasko")}, "whether",
           ["follow_up", "pronoun"])),
    CONV(["follow_up", "partial"],
         T("how did Morressi do in the marathon", "competitor_result",
           {"competitor": P("Banel Morressi"), "contest": MMAR}, "how_did", ["partial", "live"]),
         T("is he ahead of Cossren", "head_to_head",
           {"competitor": P("Banel Morressi"), "rival": P("Bosso Cossren"), "contest": MMAR}, "whether",
           ["follow_up", "pronoun", "partial", "live"]),
         T("how big is the lead", "live_leader", {"contest": MMAR}, "margin", ["follow_up"], what="margin")),
    CONV(["chatty", "follow_up"],
         T("morning! well, evening now i guess. who's won the most medals?", "most_medals", {}, "who",
           ["chatty", "tie"]),
         T("and who tops the table on golds", "medal_table_leader", {}, "who", ["follow_up"]),
         N("how many medals have been handed out in total", "count", ["follow_up"])),
    CONV(["follow_up", "number_words"],
         T("whats on the 12th", "schedule_day", {"date": "2027-08-12"}, "schedule", ["missing_apostrophe"]),
         T("just the swimming", "schedule_day", {"date": "2027-08-12", "sport": "swimming"}, "schedule",
           ["follow_up", "constraint"]),
         T("who won the women's race that night", "podium", {"contest": SWBR}, "who", ["follow_up"],
           what="winner"),
         T("and the men's one", "podium", {"contest": SMBR}, "who", ["follow_up", "ellipsis"], what="winner")),
    CONV(["follow_up", "uncovered"],
         N("how many people watched the men's basketball final", "count", []),
         T("fine, how did halvorne do in it", "delegation_in_event", {"group": "halvorne", "contest": BM},
           "how_did", ["follow_up", "not_entered", "team_event"]),
         T("which teams got medals then", "podium", {"contest": BM}, "results", ["follow_up", "team_event"])),
    CONV(["voice", "mishearing"],
         T("how did tether brel wick do in the time trial", "competitor_result",
           {"competitor": P("Tetha Brelwick"), "contest": CWTT}, "how_did", ["voice", "mishearing"]),
         T("and furrys brelketh", "competitor_result", {"competitor": P("Furrys Brelketh"), "contest": CWTT},
           "how_did", ["voice", "follow_up", "similar_names"])),
    CONV(["follow_up", "constraint"],
         T("which swimmer won the men's 100 freestyle", "podium", {"contest": SMF100}, "who", [],
           what="winner"),
         N("what was his split at the turn", "mark", ["follow_up", "pronoun"]),
         T("how many medals has he won here", "competitor_medals", {"competitor": P("Zemim Guntasand")}, "count",
           ["follow_up", "pronoun"])),
    CONV(["follow_up"],
         T("how did aubrecy do in the marathon tonight", "delegation_in_event",
           {"group": "aubrecy", "contest": MMAR}, "how_did", ["relative_day", "constraint", "live"]),
         T("and in the javelin?", "delegation_in_event", {"group": "aubrecy", "contest": MJAV}, "how_did",
           ["follow_up", "ellipsis", "live"]),
         N("which aubrecy athlete is the oldest", "other", ["follow_up"])),
]


# ---------------------------------------------------------------- checks & output
def iter_turns(cases):
    for c in cases:
        if "conversation" in c:
            for t in c["conversation"]:
                yield t
        else:
            yield c


def check(cases):
    ids = {"competitor": set(CM), "rival": set(CM), "group": set(GM), "contest": set(KM),
           "discipline": set(DISC), "sport": set(SM), "award": set(AWARDS),
           "category": {"men", "women"}}
    for t in iter_turns(cases):
        it = t.get("intent")
        assert it == "none" or it in CARD, it
        if it == "none":
            assert "slots" not in t
            continue
        for k, v in t.get("slots", {}).items():
            assert k in CARD[it], (it, k)
            if k in ids:
                assert v in ids[k], (k, v)
            elif k == "date":
                date.fromisoformat(v)
            elif k == "count":
                assert v.isdigit()


def main():
    cases = SINGLES + CONVS
    check(cases)
    header = (f"# Blind question set: scenario {SCENARIO}, moment {MOMENT} "
              f"(clock Saturday 14 August 2027 21:10 Europe/Lisbon; data as of 21:04).\n"
              f"# Written by tests/eval/blind/round1/label_games.py from dataset-demo/games/*.json.\n"
              f"# Do not edit by hand: change the script and run it again.\n")
    body = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=110)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)
    turns = list(iter_turns(cases))
    n_conv = sum(1 for c in cases if "conversation" in c)
    unc = sum(1 for t in turns if "uncovered" in t.get("tags", []))
    nc = sum(1 for t in turns if t.get("outcome") == "not_covered")
    print(f"turns={len(turns)} conversations={n_conv} singles={len(SINGLES)} "
          f"uncovered={unc} ({100 * unc / len(turns):.1f}%) not_covered={nc} ({100 * nc / len(turns):.1f}%)",
          file=sys.stderr)


if __name__ == "__main__":
    main()
