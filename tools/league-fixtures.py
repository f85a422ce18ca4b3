#!/usr/bin/env python3
"""Writes the league demo scenario (dataset-demo/league): ten invented clubs,
a double round robin of league fixtures (the circle method: every club meets
every other once at home and once away), results for the matchdays played
by the scenario's clock, one match live, one postponed, the rest scheduled,
and a knockout cup between eight of the clubs.

Scores come from a seeded generator, so running the script again writes the
same files. Usage: python3 tools/league-fixtures.py [OUT_DIR]
"""

import datetime
import json
import os
import random
import sys

OUT = sys.argv[1] if len(sys.argv) > 1 else os.path.join(
    os.path.dirname(__file__), "..", "dataset-demo", "league")

# id, name, code, aliases, ground, strength (higher scores more)
CLUBS = [
    ("ambervale", "Ambervale Town", "AMB", ["Ambervale"], "Ambervale Park", 1.7),
    ("brackenholt", "Brackenholt Rovers", "BRA", ["Brackenholt", "Rovers"], "Holt Lane", 1.5),
    ("corriestane", "Corriestane Athletic", "COR", ["Corriestane", "Athletic"], "Stane Road", 1.3),
    ("dunmerle", "Dunmerle Harriers", "DUN", ["Dunmerle", "Harriers"], "Merle Meadow", 1.2),
    ("elverstow", "Elverstow City", "ELV", ["Elverstow", "City"], "Stow Bridge Ground", 1.6),
    ("fenwarrow", "Fenwarrow Wanderers", "FEN", ["Fenwarrow", "Wanderers"], "Warrow Fields", 1.0),
    ("gorsemouth", "Gorsemouth Albion", "GOR", ["Gorsemouth", "Albion"], "The Quayside", 1.1),
    ("hollinsby", "Hollinsby United", "HOL", ["Hollinsby", "United"], "Hollin Street", 1.4),
    ("iverlock", "Iverlock", "IVE", ["Iverlock FC"], "Lockside Stadium", 0.9),
    ("kestrel", "Kestrel Bay", "KES", ["Kestrel"], "Bayfront Park", 1.0),
]

# Matchdays are Saturdays from 14 August 2027, one a week.
FIRST = datetime.date(2027, 8, 14)
# The scenario's clock: matchday 13 is under way.
CLOCK_DAY = 13
CLOCK = "2027-11-06T16:05:00+00:00"
# Which match of matchday 9 was postponed (a waterlogged pitch).
POSTPONED = (9, 2)

rng = random.Random(2027)


def goals(attack, defence):
    """A score for one side: a Poisson draw around attack / defence."""
    mean = 1.35 * attack / defence
    # Knuth's method for a Poisson variate.
    limit, k, p = pow(2.718281828459045, -mean), 0, 1.0
    while True:
        p *= rng.random()
        if p <= limit:
            return k
        k += 1


def round_robin(n):
    """Pairings per round by the circle method, home side first."""
    ids = list(range(n))
    rounds = []
    for r in range(n - 1):
        pairs = []
        for i in range(n // 2):
            a, b = ids[i], ids[n - 1 - i]
            # Alternate home and away so no club is at home every week.
            pairs.append((a, b) if (r + i) % 2 == 0 else (b, a))
        rounds.append(pairs)
        ids = [ids[0]] + [ids[-1]] + ids[1:-1]
    # The second half of the season: the same pairings the other way round.
    return rounds + [[(b, a) for a, b in rs] for rs in rounds]


def entry(club, side, score=None, place=None):
    e = {"group": CLUBS[club][0], "side": side}
    if score is not None:
        e["mark"] = str(score)
    if place is not None:
        e["place"] = place
    return e


def league_contests():
    out = []
    # Kick-off times on a matchday: the early game, the 15:00 game, two
    # at 17:30 and the evening game.
    times = ["12:30", "15:00", "17:30", "17:30", "19:45"]
    for md, pairs in enumerate(round_robin(len(CLUBS)), start=1):
        day = FIRST + datetime.timedelta(weeks=md - 1)
        for k, (h, a) in enumerate(pairs):
            hid, aid = CLUBS[h][0], CLUBS[a][0]
            c = {
                "id": f"md{md:02d}-{hid}-{aid}",
                "sport": "football",
                "discipline": "league",
                "phase": "match",
                "round": f"matchday {md}",
                "start": f"{day.isoformat()}T{times[k]}",
                "venue": CLUBS[h][4],
            }
            hs, as_ = goals(CLUBS[h][5] * 1.1, CLUBS[a][5]), goals(CLUBS[a][5], CLUBS[h][5] * 1.1)
            if (md, k) == POSTPONED:
                c["status"] = "postponed"
                c["entries"] = [entry(h, "home"), entry(a, "away")]
            elif md < CLOCK_DAY or (md == CLOCK_DAY and k == 0):
                c["status"] = "final"
                c["entries"] = [entry(h, "home", hs), entry(a, "away", as_)]
            elif md == CLOCK_DAY and k == 1:
                # Under way: the score so far, updated a minute ago.
                c["status"] = "live"
                c["updated"] = "2027-11-06T16:04:00+00:00"
                c["entries"] = [entry(h, "home", min(hs, 2)), entry(a, "away", min(as_, 1))]
            else:
                c["status"] = "scheduled"
                c["entries"] = [entry(h, "home"), entry(a, "away")]
            c["measure"] = "score"
            out.append(c)
    return out


def cup_contests():
    """A knockout cup between eight clubs: quarter-finals played (one
    level after extra time and decided on penalties), one semi-final
    played, the other and the final to come."""
    out = []

    def tie(cid, rnd, phase, day, h, a, status, score=None, places=None):
        c = {
            "id": cid,
            "sport": "football",
            "discipline": "cup",
            "phase": phase,
            "round": rnd,
            "start": f"{day}T19:45",
            "status": status,
            "measure": "score",
            "venue": CLUBS[h][4] if phase != "final" else "Vellmark Stadium",
        }
        if score:
            pl = places or (None, None)
            c["entries"] = [entry(h, "home", score[0], pl[0]), entry(a, "away", score[1], pl[1])]
        else:
            c["entries"] = [entry(h, "home"), entry(a, "away")]
        out.append(c)

    ix = {c[0]: i for i, c in enumerate(CLUBS)}
    tie("cup-qf1", "quarter-final", "quarter-final", "2027-10-13", ix["ambervale"], ix["kestrel"], "final", (3, 0))
    # Level after extra time; Dunmerle won on penalties, so they are placed first.
    tie("cup-qf2", "quarter-final", "quarter-final", "2027-10-13", ix["hollinsby"], ix["dunmerle"], "final", (1, 1), (2, 1))
    tie("cup-qf3", "quarter-final", "quarter-final", "2027-10-14", ix["elverstow"], ix["gorsemouth"], "final", (2, 1))
    tie("cup-qf4", "quarter-final", "quarter-final", "2027-10-14", ix["brackenholt"], ix["corriestane"], "final", (0, 2))
    tie("cup-sf1", "semi-final", "semi-final", "2027-11-03", ix["dunmerle"], ix["ambervale"], "final", (1, 2))
    tie("cup-sf2", "semi-final", "semi-final", "2027-11-10", ix["corriestane"], ix["elverstow"], "scheduled")
    return out


def main():
    os.makedirs(OUT, exist_ok=True)
    scenario = {
        "id": "league",
        "title": "The 2027–28 Vellmark League",
        "time_zone": "Europe/London",
        "as_of": "2027-11-06T16:04:00+00:00",
        "clock": CLOCK,
        "group_noun": "club",
        "contest_noun": "match",
        "score_unit": "goal",
        "tables": [
            {
                "id": "league",
                "name": "Vellmark League table",
                "count": "results",
                "sport": "football",
                "discipline": "league",
                "points": {"win": 3, "draw": 1, "loss": 0},
                "order": ["points", "difference", "scored", "head_to_head"],
            }
        ],
    }
    sports = [{
        "id": "football",
        "name": "football",
        "noun": "player",
        "disciplines": [
            # "league" and "cup" alone are words of questions ("top of the
            # league"), not names of a competition.
            {"id": "league", "name": "Vellmark League"},
            {"id": "cup", "name": "Vellmark Cup", "aliases": ["cup"]},
        ],
    }]
    # Clubs take plural verbs in British newsrooms ("Ambervale are top").
    groups = [{"id": c[0], "name": c[1], "code": c[2], "aliases": c[3], "plural": True} for c in CLUBS]
    contests = league_contests() + cup_contests()
    files = {
        "scenario.json": scenario,
        "sports.json": sports,
        "groups.json": groups,
        "competitors.json": [],
        "contests.json": contests,
    }
    for name, value in files.items():
        with open(os.path.join(OUT, name), "w", encoding="utf-8") as f:
            json.dump(value, f, indent=2, ensure_ascii=False)
            f.write("\n")


if __name__ == "__main__":
    main()
