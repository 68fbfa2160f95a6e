"""design_many with mixed codes on several threads, run by scripts/tsan.sh under
ThreadSanitizer: results identical to sequential design, no race reported."""
import armature, random
rng = random.Random(3)
reqs = []
for i in range(300):
    if i % 2:
        reqs.append({"code": "ACI318-19", "slab": {"spans_m": [rng.uniform(3, 6)], "ends": ["pinned", "pinned"], "thickness_mm": 200}, "concrete": {"cylinder_strength_MPa": 28}, "loads": {"imposed_kPa": rng.uniform(1.5, 6)}})
    else:
        reqs.append({"code": "EN1992-1-1", "variant": rng.choice(["UK", "recommended"]), "slab": {"spans_m": [rng.uniform(3, 6), 4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200}, "concrete": {"class": "C30/37"}, "loads": {"imposed_kPa": rng.uniform(1.5, 6)}})
many = armature.design_many(reqs, threads=3)
assert many == [armature.design(r) for r in reqs]
print("design_many under TSan: identical results for", len(reqs), "mixed requests")
