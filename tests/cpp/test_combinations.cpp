// Combinations of actions of both codes, factor by factor: EN 1990 (6.10),
// (6.10a/b), (6.14b)-(6.16b) and Table A1.2(A) with the ψ of Table A1.1 and
// the shipped variants' values; ACI 318-19 5.3.1 by equation.
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <string>

#include "aci318/combinations.hpp"
#include "en1992/en1990.hpp"
#include "en1992/ndp.hpp"

using namespace armature;
namespace fs = std::filesystem;

namespace {

en1992::En1990Factors factors_of(const std::string& variant) {
  return en1992::en1990_factors(
      en1992::read_ndp_file(fs::path(ARMATURE_CODE_DIR) / "en1992" / (variant + ".json")));
}

Action uniform(const std::string& name, ActionKind kind, const std::string& category = "") {
  Action a;
  a.name = name;
  a.kind = kind;
  a.category = kind == ActionKind::roof ? "H" : category;
  a.value = 1e-3;
  return a;
}

// Self-weight, a category C floor load and snow: a terrace of the workshop.
std::vector<Action> floor_with_snow() {
  return {uniform("self-weight", ActionKind::permanent), uniform("benches", ActionKind::imposed, "C"),
          uniform("snow", ActionKind::snow)};
}

std::vector<const Combination*> of_state(const std::vector<Combination>& all, LimitState s) {
  std::vector<const Combination*> out;
  for (const auto& c : all)
    if (c.limit_state == s) out.push_back(&c);
  return out;
}

// The combination of `state` whose factor on action i is `lead` (the leading one).
const Combination& leading(const std::vector<Combination>& all, LimitState s, std::size_t i, double lead) {
  for (const auto& c : all)
    if (c.limit_state == s && c.factors[i].loaded == Approx(lead)) return c;
  FAIL("no such combination");
  return all.front();
}

}  // namespace

TEST_CASE("EN 1990 6.10 with imposed and snow: each leads in turn, the other with psi0") {
  // Table A1.2(B): γG 1.35, γQ 1.5 (recommended; the UK NA keeps them, from
  // memory). Table A1.1: ψ0 = 0.7 for category C, 0.5 for snow.
  for (const char* variant : {"recommended", "UK"}) {
    const auto f = factors_of(variant);
    const auto all = en1992::en1990_combinations(f, false, floor_with_snow());
    const auto uls = of_state(all, LimitState::uls);
    REQUIRE(uls.size() == 2);
    const Combination& q = leading(all, LimitState::uls, 1, 1.5);
    CHECK(q.factors[0].loaded == Approx(1.35));
    CHECK(q.factors[0].unloaded == Approx(1.35));  // EN 1992-1-1 5.1.3: γG on every span
    CHECK(q.factors[2].loaded == Approx(1.5 * 0.5));
    CHECK(q.factors[2].unloaded == 0.0);
    CHECK(q.label == "6.10, leading imposed: 1.35 Gk + 1.5 benches + 0.75 snow");
    const Combination& s = leading(all, LimitState::uls, 2, 1.5);
    CHECK(s.factors[1].loaded == Approx(1.5 * 0.7));
  }
}

TEST_CASE("EN 1990 6.10a and 6.10b with the variant's xi and psi0") {
  // 6.10a: γG Gk + γQ ψ0 Q for every variable action; 6.10b: ξ γG Gk + γQ Q1
  // + γQ ψ0 Qi. ξ = 0.85 recommended, 0.925 UK NA (from memory).
  for (const auto& [variant, xi] : {std::pair{"recommended", 0.85}, std::pair{"UK", 0.925}}) {
    const auto all = en1992::en1990_combinations(factors_of(variant), true, floor_with_snow());
    const auto uls = of_state(all, LimitState::uls);
    REQUIRE(uls.size() == 3);  // 6.10a once, 6.10b with each leading action
    CHECK(uls[0]->label.rfind("6.10a: ", 0) == 0);
    CHECK(uls[0]->factors[0].loaded == Approx(1.35));
    CHECK(uls[0]->factors[1].loaded == Approx(1.5 * 0.7));
    CHECK(uls[0]->factors[2].loaded == Approx(1.5 * 0.5));
    for (const Combination* c : {uls[1], uls[2]}) {
      CHECK(c->label.rfind("6.10b", 0) == 0);
      CHECK(c->factors[0].loaded == Approx(xi * 1.35));
    }
    CHECK(uls[1]->factors[1].loaded == Approx(1.5));
    CHECK(uls[1]->factors[2].loaded == Approx(0.75));
    CHECK(uls[2]->factors[1].loaded == Approx(1.05));
    CHECK(uls[2]->factors[2].loaded == Approx(1.5));
  }
}

TEST_CASE("EN 1990 serviceability combinations by Table A1.1") {
  // Characteristic G + Q1 + ψ0 Qi (6.14b); frequent G + ψ1 Q1 + ψ2 Qi
  // (6.15b); quasi-permanent G + ψ2 Q (6.16b). Category C: 0.7/0.7/0.6,
  // snow 0.5/0.2/0 (altitude ≤ 1000 m; the UK NA the same, from memory).
  for (const char* variant : {"recommended", "UK"}) {
    const auto all = en1992::en1990_combinations(factors_of(variant), false, floor_with_snow());
    CHECK(leading(all, LimitState::characteristic, 1, 1.0).factors[2].loaded == Approx(0.5));
    CHECK(leading(all, LimitState::characteristic, 2, 1.0).factors[1].loaded == Approx(0.7));
    const Combination& fq = leading(all, LimitState::frequent, 1, 0.7);
    CHECK(fq.factors[2].loaded == Approx(0.0));
    const Combination& fs = leading(all, LimitState::frequent, 2, 0.2);
    CHECK(fs.factors[1].loaded == Approx(0.6));
    const auto qp = of_state(all, LimitState::quasi_permanent);
    REQUIRE(qp.size() == 1);
    CHECK(qp[0]->factors[0].loaded == 1.0);
    CHECK(qp[0]->factors[1].loaded == Approx(0.6));
    CHECK(qp[0]->factors[2].loaded == Approx(0.0));
  }
}

TEST_CASE("EN 1990 EQU by Table A1.2(A)") {
  // γG,sup 1.10 (unfavourable, on the loaded cantilever), γG,inf 0.90
  // (favourable, elsewhere), γQ 1.50: recommended values, kept by the UK
  // NA (from memory).
  for (const char* variant : {"recommended", "UK"}) {
    const auto all = en1992::en1990_combinations(factors_of(variant), false, floor_with_snow());
    const Combination& e = leading(all, LimitState::equilibrium, 1, 1.5);
    CHECK(e.factors[0].loaded == Approx(1.1));
    CHECK(e.factors[0].unloaded == Approx(0.9));
    CHECK(e.factors[2].loaded == Approx(0.75));
  }
}

TEST_CASE("EN 1991-1-1 3.3.2 roof imposed loads are not combined with snow") {
  const std::vector<Action> roof{uniform("self-weight", ActionKind::permanent),
                                 uniform("maintenance", ActionKind::roof), uniform("snow", ActionKind::snow)};
  const auto all = en1992::en1990_combinations(factors_of("recommended"), false, roof);
  const auto uls = of_state(all, LimitState::uls);
  REQUIRE(uls.size() == 2);
  for (const Combination* c : uls) CHECK((c->factors[1].loaded == 0.0 || c->factors[2].loaded == 0.0));
  CHECK(leading(all, LimitState::uls, 1, 1.5).factors[2].loaded == 0.0);
  CHECK(leading(all, LimitState::uls, 2, 1.5).factors[1].loaded == 0.0);
}

TEST_CASE("EN 1991-1-1 3.3.1 imposed loads of several categories act as one action") {
  // Both lead together (γQ each); each accompanies snow with its own ψ0
  // (Table A1.1, recommended: 0.7 for C, 1.0 for E).
  const std::vector<Action> mixed{uniform("self-weight", ActionKind::permanent),
                                  uniform("benches", ActionKind::imposed, "C"),
                                  uniform("store", ActionKind::imposed, "E"), uniform("snow", ActionKind::snow)};
  const auto all = en1992::en1990_combinations(factors_of("recommended"), false, mixed);
  const auto uls = of_state(all, LimitState::uls);
  REQUIRE(uls.size() == 2);
  const Combination& q = leading(all, LimitState::uls, 1, 1.5);
  CHECK(q.factors[2].loaded == Approx(1.5));
  const Combination& s = leading(all, LimitState::uls, 3, 1.5);
  CHECK(s.factors[1].loaded == Approx(1.05));
  CHECK(s.factors[2].loaded == Approx(1.5));
}

TEST_CASE("EN 1990 labels of a single imposed action are those of version 1") {
  const std::vector<Action> v1{uniform("self-weight", ActionKind::permanent),
                               uniform("imposed", ActionKind::imposed, "H")};
  const auto a = en1992::en1990_combinations(factors_of("UK"), false, v1);
  CHECK(a[0].label == "6.10: 1.35 Gk + 1.5 Qk");
  const auto b = en1992::en1990_combinations(factors_of("UK"), true, v1);
  CHECK(b[0].label == "6.10a: 1.35 Gk + 1.05 Qk (ψ0 = 0.7 for category H, UK variant NDP)");
  CHECK(b[1].label == "6.10b: 1.249 Gk + 1.5 Qk (ξ = 0.925, UK variant NDP)");
}

TEST_CASE("ACI 318-19 5.3.1 for D, L, Lr and S") {
  // (a) 1.4D; (b) 1.2D + 1.6L + 0.5(Lr or S); (c) 1.2D + 1.6(Lr or S) + 1.0L.
  const std::vector<Action> all_kinds{uniform("D", ActionKind::permanent), uniform("L", ActionKind::imposed, "B"),
                                      uniform("Lr", ActionKind::roof), uniform("S", ActionKind::snow)};
  const auto all = aci318::aci_combinations(all_kinds);
  const auto uls = of_state(all, LimitState::uls);
  REQUIRE(uls.size() == 5);
  auto f = [](const Combination* c) {
    return std::vector<double>{c->factors[0].loaded, c->factors[1].loaded, c->factors[2].loaded,
                               c->factors[3].loaded};
  };
  CHECK(f(uls[0]) == std::vector<double>{1.4, 0, 0, 0});
  CHECK(f(uls[1]) == std::vector<double>{1.2, 1.6, 0.5, 0});
  CHECK(f(uls[2]) == std::vector<double>{1.2, 1.6, 0, 0.5});
  CHECK(f(uls[3]) == std::vector<double>{1.2, 1.0, 1.6, 0});
  CHECK(f(uls[4]) == std::vector<double>{1.2, 1.0, 0, 1.6});
  CHECK(uls[3]->label == "5.3.1c: 1.2 D + 1.6 Lr + 1 L");
  for (const Combination* c : uls) CHECK(c->factors[0].unloaded == c->factors[0].loaded);
  const auto sustained = of_state(all, LimitState::quasi_permanent);
  REQUIRE(sustained.size() == 1);
  CHECK(f(sustained[0]) == std::vector<double>{1, 0, 0, 0});
}

TEST_CASE("ACI 318-19 5.3.1 for D and L keeps the version 1 labels") {
  const std::vector<Action> dl{uniform("D", ActionKind::permanent), uniform("L", ActionKind::imposed, "B")};
  const auto all = aci318::aci_combinations(dl);
  const auto uls = of_state(all, LimitState::uls);
  REQUIRE(uls.size() == 2);
  CHECK(uls[0]->label == "5.3.1a: 1.4 D");
  CHECK(uls[1]->label == "5.3.1b: 1.2 D + 1.6 L");
}
