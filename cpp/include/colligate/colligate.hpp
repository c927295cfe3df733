#pragma once
/// \file colligate.hpp
/// Umbrella header for the stable C++ API of colligate.
///
/// Layers (DESIGN.md section 3): core/ (constants, errors, validity, solution),
/// data/ (solute records, the built-in table, citations), water/ (ice and vapour
/// pressures), models/ (activity models), equilibria/ (freezing point, ice fraction).

#include "colligate/core/bound_water.hpp"
#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/data/dairy_rules.hpp"
#include "colligate/data/ethanol_water_density.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/data/weak_acids.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/equilibria/ice_fraction_temperature.hpp"
#include "colligate/equilibria/leighton_method.hpp"
#include "colligate/equilibria/salt_equilibrium.hpp"
#include "colligate/equilibria/salt_solubility.hpp"
#include "colligate/equilibria/seawater_freezing_line.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/equilibria/weak_acid_dissociation.hpp"
#include "colligate/models/ideal.hpp"
#include "colligate/models/builtin_models.hpp"
#include "colligate/models/registry.hpp"
#include "colligate/models/mixing.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/pitzer_single_salt.hpp"
#include "colligate/models/raoult.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/thermal/components.hpp"
#include "colligate/thermal/enthalpy.hpp"
#include "colligate/thermal/frozen_specific_heat.hpp"
#include "colligate/water/ice.hpp"
#include "colligate/water/vapour_pressure.hpp"

namespace colligate {
using equilibria::eutectic;
using equilibria::freezing_point;
using equilibria::ice_fraction;
using equilibria::unfrozen_phase_at;
using equilibria::ice_curve;
using models::builtin_models;
using models::model_choice;
using models::water_activity;
using models::osmotic_coefficient;
}  // namespace colligate
