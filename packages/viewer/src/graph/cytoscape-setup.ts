import cytoscape from "cytoscape";
import fcose from "cytoscape-fcose";

// Registered once: the force layout used when the data carries no node coordinates.
cytoscape.use(fcose);

export { cytoscape };
