"""Shared labelling code for the election blind sets (round 5).
Reads dataset-demo/election, applies replay batches up to a moment and
computes every expected fact for each question's intended meaning."""
import json, glob, copy, os, math, yaml

HERE = os.path.dirname(os.path.abspath(__file__))
D = os.path.normpath(os.path.join(HERE, '..', '..', '..', '..', 'dataset-demo', 'election'))
CONTESTS = {c['id']: c for c in json.load(open(D + '/contests.json'))}
PEOPLE = {c['id']: c for c in json.load(open(D + '/competitors.json'))}
GROUPS = {g['id']: g for g in json.load(open(D + '/groups.json'))}
WARDS = {d['id']: d['name'] for s in json.load(open(D + '/sports.json')) for d in s['disciplines']}
WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine']


def state(n_batches):
    S = copy.deepcopy(CONTESTS)
    for f in sorted(glob.glob(D + '/replay/*.json'))[:n_batches]:
        for ch in json.load(open(f))['changes']:
            if ch['change'] != 'results':
                continue
            s = S[ch['contest']]
            for k in ('status', 'entries', 'counted', 'updated'):
                if k in ch:
                    s[k] = ch[k]
    return S


def name(cid):
    p = PEOPLE[cid]
    return p['given'] + ' ' + p['family']


def votes(e):
    return int(str(e['mark']).replace(',', ''))


def fmt(n):
    return '{:,}'.format(n)


def cnt(n):
    return WORDS[n] if n < 10 else str(n)


def ordinal(n):
    return {1: '1st', 2: '2nd', 3: '3rd'}.get(n, '%dth' % n)


class Facts:
    def __init__(self, n_batches):
        self.S = state(n_batches)

    def ranked(self, k):
        c = self.S[k]
        if c['status'] == 'scheduled' or not any('mark' in e for e in c['entries']):
            return None
        return sorted(c['entries'], key=lambda e: e['place'])

    def total(self, k):
        return sum(votes(e) for e in self.ranked(k))

    def share(self, k, e):
        return '%.1f%%' % (100.0 * votes(e) / self.total(k))

    def ward_of(self, cid):
        for k, c in self.S.items():
            if any(e['competitor'] == cid for e in c['entries']):
                return k

    def entry(self, cid):
        k = self.ward_of(cid)
        r = self.ranked(k)
        if r is None:
            return k, None
        return k, [e for e in r if e['competitor'] == cid][0]

    def seats(self):
        t = {}
        for k, c in self.S.items():
            if c['status'] == 'final':
                for e in c['entries']:
                    if e.get('award') == 'seat':
                        g = PEOPLE[e['competitor']]['group']
                        t[g] = t.get(g, 0) + 1
        return t

    # ---- one function per intent: returns (outcome, says, never) ----
    def ward_winner(self, contest=None, **_):
        if contest is None:
            return 'clarify', [], []
        c = self.S[contest]
        r = self.ranked(contest)
        if c['status'] != 'final':
            return 'no_data', [], []
        return 'answered', [name(r[0]['competitor'])], [name(r[1]['competitor'])]

    def ward_leader(self, contest=None, **_):
        if contest is None:
            return 'clarify', [], []
        r = self.ranked(contest)
        if r is None:
            return 'no_data', [], []
        return 'answered', [name(r[0]['competitor']), fmt(votes(r[0]) - votes(r[1]))], []

    def ward_place(self, contest=None, place=None, **_):
        if contest is None or place is None:
            return 'clarify', [], []
        r = self.ranked(contest)
        p = int(place)
        if r is None or p > len(r):
            return 'no_data', [], []
        others = [name(e['competitor']) for e in r if e['place'] != p]
        return 'answered', [name(r[p - 1]['competitor'])], []

    def ward_results(self, contest=None, **_):
        if contest is None:
            return 'clarify', [], []
        r = self.ranked(contest)
        if r is None:
            return 'no_data', [], []
        says = []
        for e in r:
            says += [name(e['competitor']), fmt(votes(e))]
        return 'answered', says, []

    def count_progress(self, contest=None, **_):
        if contest is None:
            return 'clarify', [], []
        c = self.S[contest]
        if c.get('counted') is None:
            return 'answered', [], []
        return 'answered', ['%d%%' % math.floor(c['counted'] * 100 + 1e-9)], []

    def party_in_ward(self, group=None, contest=None, **_):
        if group is None or contest is None:
            return 'clarify', [], []
        ents = [e for e in self.S[contest]['entries'] if PEOPLE[e['competitor']]['group'] == group]
        if not ents:
            return 'no_data', [], []
        cid = ents[0]['competitor']
        r = self.ranked(contest)
        if r is None:
            return 'no_data', [name(cid)], []
        e = [x for x in r if x['competitor'] == cid][0]
        return 'answered', [name(cid), fmt(votes(e))], []

    def party_seats(self, group=None, **_):
        if group is None:
            return 'clarify', [], []
        n = self.seats().get(group, 0)
        if n == 0:
            return 'answered', [], []
        return 'answered', [cnt(n)], []

    def seat_totals(self, count=None, **_):
        t = self.seats()
        order = sorted(t.items(), key=lambda kv: -kv[1])
        if count:
            order = order[:int(count)]
        says = []
        for g, n in order:
            says += [GROUPS[g]['name'], cnt(n)]
        return 'answered', says, []

    def open_races(self, **_):
        op = [WARDS[k] for k, c in self.S.items() if c['status'] != 'final']
        closed = [WARDS[k] for k, c in self.S.items() if c['status'] == 'final']
        return 'answered', op, []

    def candidate_party(self, competitor=None, **_):
        if competitor is None:
            return 'clarify', [], []
        p = PEOPLE[competitor]
        return 'answered', [GROUPS[p['group']]['name'], WARDS[self.ward_of(competitor)]], []

    def candidate_result(self, competitor=None, contest=None, **_):
        if competitor is None:
            return 'clarify', [], []
        k, e = self.entry(competitor)
        if self.S[k]['status'] != 'final':
            return 'no_data', [], []
        if e.get('award') == 'seat':
            return 'answered', [fmt(votes(e))], []
        r = self.ranked(k)
        return 'answered', [name(r[0]['competitor'])], []

    def candidate_margin(self, competitor=None, contest=None, **_):
        if competitor is None:
            return 'clarify', [], []
        k, e = self.entry(competitor)
        r = self.ranked(k)
        if r is None:
            return 'no_data', [], []
        if self.S[k]['status'] != 'final':
            # live: the gap as it stands to the leader (or, for the leader, to 2nd)
            pass
        if e['place'] == 1:
            return 'answered', [fmt(votes(e) - votes(r[1])), name(r[1]['competitor'])], []
        return 'answered', [fmt(votes(r[0]) - votes(e)), name(r[0]['competitor'])], []

    def candidates_compared(self, competitor=None, rival=None, contest=None, **_):
        if competitor is None or rival is None:
            return 'clarify', [], []
        k, a = self.entry(competitor)
        k2, b = self.entry(rival)
        if a is None or b is None:
            return 'no_data', [], []
        ahead = a if a['place'] < b['place'] else b
        return 'answered', [name(ahead['competitor'])], []

    def greeting(self, **_):
        return 'answered', [], []
    help = greeting
    thanks = greeting


def T(ask, intent, focus, tags=(), says=None, never=None, outcome=None, **slots):
    return dict(ask=ask, intent=intent, focus=focus, tags=list(tags), slots=slots,
                x_says=says, x_never=never, x_outcome=outcome)


def C(turns, tags=()):
    return dict(conversation=turns, tags=list(tags))


def label(F, t):
    out = {'ask': t['ask'], 'intent': t['intent']}
    if t['intent'] == 'none':
        outcome, says, never = t['x_outcome'] or 'not_covered', [], []
    else:
        out['slots'] = {k: v for k, v in t['slots'].items()}
        outcome, says, never = getattr(F, t['intent'])(**t['slots'])
        if t['x_outcome']:
            outcome = t['x_outcome']
    if t['x_says'] is not None:
        says = t['x_says'](F) if callable(t['x_says']) else t['x_says']
    if t['x_never'] is not None:
        never = t['x_never'](F) if callable(t['x_never']) else t['x_never']
    out['outcome'] = outcome
    out['focus'] = t['focus']
    if says:
        out['says'] = says
    if never:
        out['never'] = never
    tags = list(t['tags'])
    if outcome in ('not_covered', 'no_data') and 'uncovered' not in tags:
        tags.append('uncovered')
    if outcome == 'clarify' and 'clarify' not in tags:
        tags.append('clarify')
    out['tags'] = tags
    return out


def build(cases, n_batches, path, moment, script):
    F = Facts(n_batches)
    res = []
    turns = convs = unc = 0
    for c in cases:
        if 'conversation' in c:
            assert 2 <= len(c['conversation']) <= 6, c
            ts = [label(F, t) for t in c['conversation']]
            res.append({'conversation': ts, 'tags': c['tags']})
            convs += 1
        else:
            ts = [label(F, c)]
            res.append(ts[0])
        for t in ts:
            turns += 1
            if t['intent'] == 'none' and t['outcome'] in ('not_covered', 'not_understood') or t['outcome'] in ('not_covered', 'no_data'):
                unc += 1
    asks = [t['ask'].lower() for c in res for t in (c.get('conversation') or [c])]
    with open(path, 'w') as f:
        f.write('# Blind question set: scenario election, moment %s.\n' % moment)
        f.write('# Written by %s (labels computed from dataset-demo/election and its replay batches).\n' % script)
        yaml.safe_dump(res, f, sort_keys=False, allow_unicode=True, width=1000)
    print(path, 'cases', len(res), 'turns', turns, 'conversations', convs,
          'uncovered %.1f%%' % (100.0 * unc / turns))
    dup = [a for a in set(asks) if asks.count(a) > 1]
    if dup:
        print('duplicate asks:', dup)
    return res


def standing(cid):
    """says-list for how a candidate stands now: place and votes."""
    def f(F):
        k, e = F.entry(cid)
        if e is None:
            return []
        return [ordinal(e['place']), fmt(votes(e))]
    return f
