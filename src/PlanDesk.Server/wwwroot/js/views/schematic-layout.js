// Where each element of the schematic goes: columns from the network's structure (plants, the tanks at each
// plant, regional reservoirs by how many pipelines they are from a plant, customers), and rows that keep each
// element near what feeds it without overlapping.

export const size = {
  plantWidth: 250, tankWidth: 220, customerWidth: 240, columnGap: 80,
  plantHeader: 46, stageRow: 22, tankHeight: 46, customerHeight: 46, rowGap: 10, groupGap: 26, margin: 16,
};

function plantHeight(plant) {
  return size.plantHeader + size.stageRow * (plant.stages.length + (plant.engineUse ? 1 : 0)) + 8;
}

/** Depth of each tank: 1 for tanks at a plant, 1 + deepest source for reservoirs fed by pipelines. */
function tankDepths(schematic) {
  const depth = new Map(schematic.tanks.map(t => [t.tankId, t.plantId ? 1 : 2]));
  const intoTanks = schematic.pipelines.filter(p => p.toKind === 'tank');
  for (let pass = 0; pass < schematic.tanks.length; pass++) {
    let changed = false;
    for (const pipe of intoTanks) {
      const target = schematic.tanks.find(t => t.tankId === pipe.toId);
      const wanted = (depth.get(pipe.fromTankId) ?? 1) + 1;
      if (target && !target.plantId && depth.get(target.tankId) < wanted) {
        depth.set(target.tankId, wanted);
        changed = true;
      }
    }
    if (!changed) {
      break;
    }
  }
  return depth;
}

/** Places boxes of one column at their wanted y in order, pushing each down below the one before. */
function stack(items, height, gap) {
  items.sort((a, b) => a.wanted - b.wanted);
  let next = size.margin;
  for (const item of items) {
    item.y = Math.max(item.wanted, next);
    next = item.y + height(item) + gap;
  }
}

/** Returns boxes {x, y, width, height} for plants, tanks and customers, the columns' x, and the drawing size. */
export function layout(schematic) {
  const depth = tankDepths(schematic);
  const maxDepth = Math.max(1, ...depth.values());
  const columnX = [size.margin];
  columnX.push(columnX[0] + size.plantWidth + size.columnGap);
  for (let d = 2; d <= maxDepth; d++) {
    columnX.push(columnX[d - 1] + size.tankWidth + size.columnGap);
  }
  const customerX = columnX[maxDepth] + size.tankWidth + size.columnGap;
  const boxes = new Map();

  // Plants down the left, each with its own tanks beside it.
  let y = size.margin;
  for (const plant of schematic.plants) {
    const height = plantHeight(plant);
    boxes.set(`plant:${plant.plantId}`, { x: columnX[0], y, width: size.plantWidth, height });
    let tankY = y;
    for (const tank of schematic.tanks.filter(t => t.plantId === plant.plantId)) {
      boxes.set(`tank:${tank.tankId}`, { x: columnX[1], y: tankY, width: size.tankWidth, height: size.tankHeight });
      tankY += size.tankHeight + size.rowGap;
    }
    y = Math.max(y + height, tankY - size.rowGap) + size.groupGap;
  }

  const centreOf = key => {
    const box = boxes.get(key);
    return box ? box.y + box.height / 2 : null;
  };
  const wantedFrom = sources => {
    const centres = sources.map(centreOf).filter(c => c !== null);
    return centres.length ? centres.reduce((a, b) => a + b, 0) / centres.length : size.margin;
  };

  // Reservoirs, column by column, near the tanks that fill them.
  for (let d = 2; d <= maxDepth; d++) {
    const column = schematic.tanks.filter(t => !t.plantId && depth.get(t.tankId) === d).map(tank => ({
      tank,
      wanted: wantedFrom(schematic.pipelines.filter(p => p.toId === tank.tankId).map(p => `tank:${p.fromTankId}`)) - size.tankHeight / 2,
    }));
    stack(column, () => size.tankHeight, size.rowGap + 14);
    for (const item of column) {
      boxes.set(`tank:${item.tank.tankId}`, { x: columnX[d], y: item.y, width: size.tankWidth, height: size.tankHeight });
    }
  }

  // Customers on the right, near the tanks that serve them.
  const customers = schematic.customers.map(customer => ({
    customer,
    wanted: wantedFrom(schematic.pipelines.filter(p => p.toId === customer.customerId).map(p => `tank:${p.fromTankId}`)) - size.customerHeight / 2,
  }));
  stack(customers, () => size.customerHeight, size.rowGap);
  for (const item of customers) {
    boxes.set(`customer:${item.customer.customerId}`, { x: customerX, y: item.y, width: size.customerWidth, height: size.customerHeight });
  }

  const bottom = Math.max(...[...boxes.values()].map(b => b.y + b.height));
  return { boxes, width: customerX + size.customerWidth + size.margin, height: bottom + size.margin };
}

/** The y of a stage's row inside its plant's box. */
export function stageRowY(plantBox, index) {
  return plantBox.y + size.plantHeader + index * size.stageRow;
}
