"""Generated scenarios for the robustness scripts (signals, scale): any number of people, days
and shifts, with a plausible mix of skills, contracts, absences, requests, cover and rules.
Everything is invented and deterministic for a given seed."""
import datetime
import random

SHIFT_TEMPLATES = [
    ("E", "06:00", "14:00", 30),
    ("L", "14:00", "22:00", 30),
    ("N", "22:00", "06:00", 30),
    ("D", "08:00", "16:30", 30),
    ("M", "10:00", "18:00", 30),
    ("T", "12:00", "20:00", 30),
]


def scenario_yaml(people, days, shifts=3, seed=1, start=datetime.date(2027, 3, 1), cover=0.45):
    """Scenario text. `cover` is the share of people asked for on an average day."""
    rng = random.Random(seed)
    end = start + datetime.timedelta(days=days - 1)
    used = SHIFT_TEMPLATES[:shifts]
    out = [f"name: Generated {people} people x {days} days x {shifts} shifts",
           f"period: {{start: {start.isoformat()}, end: {end.isoformat()}}}",
           "shifts:"]
    for sid, a, b, brk in used:
        out.append(f'  - {{id: {sid}, start: "{a}", end: "{b}", break_minutes: {brk}}}')
    out.append("skills: [rn, hca]")
    # Paid hours are 7.5 a shift; full time works about 5 days in 7.
    full = round(days * 5 / 7 * 7.5)
    out += ["contracts:",
            f"  full: {{hours: {{min: {max(0, full - 16)}, max: {full + 8}}}}}",
            f"  part: {{hours: {{max: {full // 2 + 8}}}}}",
            "staff:"]
    rn_count = 0
    for i in range(people):
        sid = f"p{i:04d}"
        skills = ["rn"] if i % 10 < 6 else (["hca"] if i % 10 < 9 else ["rn", "hca"])
        rn_count += "rn" in skills
        contract = "part" if i % 4 == 3 else "full"
        extra = []
        if days >= 5 and rng.random() < 0.15:
            a = rng.randrange(days)
            b = min(days - 1, a + rng.randrange(4))
            extra.append("absences: [{from: %s, to: %s, reason: leave}]"
                         % (start + datetime.timedelta(days=a), start + datetime.timedelta(days=b)))
        if rng.random() < 0.3:
            d = start + datetime.timedelta(days=rng.randrange(days))
            extra.append(f"requests: [{{date: {d}, off: true, weight: 2}}]")
        if rng.random() < 0.2:
            extra.append("history: [E, E, off]" if shifts >= 1 else "")
        fields = [f"id: {sid}", f"contract: {contract}", f"skills: [{', '.join(skills)}]"] + [e for e in extra if e]
        out.append("  - {" + ", ".join(fields) + "}")
    out.append("demand:")
    per_day = max(1, round(people * cover))
    for k, (sid, *_rest) in enumerate(used):
        share = per_day / len(used)
        rn = max(1, round(share * 0.6)) if people > 1 else 1
        hca = max(0, round(share * 0.4)) if people > 1 else 0
        out.append(f"  - {{shift: {sid}, skill: rn, min: {max(0, rn - 1)}, target: {rn}}}")
        if hca:
            out.append(f"  - {{shift: {sid}, skill: hca, min: {max(0, hca - 1)}, target: {hca}, days: [weekdays]}}")
    out += ["rules:",
            "  list:",
            "    - {kind: min-rest, hours: 11, severity: hard}",
            "    - {kind: max-consecutive-days, days: 6, severity: hard}",
            "    - {kind: max-hours, hours: 48, window_days: 7, severity: hard}",
            "    - {kind: max-weekends, count: 3, severity: soft, weight: 5}",
            "    - {kind: min-consecutive-off, days: 2, severity: soft, weight: 1}"]
    if shifts >= 3:
        out += ["    - {kind: forbid-sequence, sequence: [N, E], severity: hard}",
                "    - {kind: days-off-after, shift: N, days: 2, severity: soft, weight: 3}",
                "    - {kind: fair-share, shift: N}"]
    return "\n".join(out) + "\n"


def write_scenario(path, *args, **kwargs):
    with open(path, "w", encoding="utf-8") as f:
        f.write(scenario_yaml(*args, **kwargs))
    return path
