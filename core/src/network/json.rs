//! A network as a JSON document of hydrograde's own schema, version 1:
//!
//! ```text
//! {
//!   "hydrograde_network": 1,
//!   "nodes": [
//!     { "name": "tank", "head": 40.0 },                       fixed head, m (free surface)
//!     { "name": "well", "head": 12.0, "elevation": 3.0 },     fixed head read at 3 m
//!     { "name": "a", "elevation": 5.0, "outflow": 0.004 }     junction, m and m³/s
//!   ],
//!   "links": [
//!     { "name": "main", "upstream": "tank", "downstream": "a", "line": { … } }
//!   ],
//!   "options": { … }                                          optional solver options
//! }
//! ```
//!
//! A link's `line` is the line's own serialised form (its elements and options). Reading
//! goes through the same checked constructors as building in code ([`Network::node`],
//! [`Network::fixed_head`], [`Network::link`], [`Network::set_options`], and the line's own
//! checks), so a document can hold nothing a program could not build; every error names
//! the node or link (by position and name) and the rule it broke. A document of another
//! version is refused.

use super::{Network, NetworkOptions, NodeKind};
use crate::error::{Error, Result};
use crate::line::Line;
use serde::{Deserialize, Serialize};

/// The schema version [`Network::to_json`] writes and [`Network::from_json`] reads.
pub const NETWORK_JSON_VERSION: u32 = 1;

#[derive(Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
struct NodeDoc {
    name: String,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    elevation: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    outflow: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    head: Option<f64>,
}

#[derive(Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
struct LinkDoc {
    name: String,
    upstream: String,
    downstream: String,
    line: serde_json::Value,
}

#[derive(Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
struct NetworkDoc {
    hydrograde_network: u32,
    nodes: Vec<NodeDoc>,
    links: Vec<LinkDoc>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    options: Option<NetworkOptions>,
}

/// Prefixes an error's reason with where in the document it arose.
fn at(what: String, e: Error) -> Error {
    Error::invalid("json", format!("{what}: {e}"))
}

impl Network {
    /// The network as a JSON document of schema version [`NETWORK_JSON_VERSION`] (module
    /// docs of `network::json`). Numbers keep every bit: reading the text back gives an
    /// equal network.
    ///
    /// # Errors
    /// A value that cannot be written as JSON (none is expected: every number is finite).
    pub fn to_json(&self) -> Result<String> {
        let nodes = self
            .nodes
            .iter()
            .map(|n| match n.kind {
                NodeKind::Junction { outflow } => NodeDoc {
                    name: n.name.clone(),
                    elevation: Some(n.elevation),
                    outflow: Some(outflow),
                    head: None,
                },
                NodeKind::FixedHead { head } => NodeDoc {
                    name: n.name.clone(),
                    elevation: n.elevation_given.then_some(n.elevation),
                    outflow: None,
                    head: Some(head),
                },
            })
            .collect();
        let links = self
            .links
            .iter()
            .map(|l| {
                Ok(LinkDoc {
                    name: l.name.clone(),
                    upstream: self.nodes[l.upstream].name.clone(),
                    downstream: self.nodes[l.downstream].name.clone(),
                    line: serde_json::to_value(&l.line)
                        .map_err(|e| Error::invalid("line", format!("link \"{}\": {e}", l.name)))?,
                })
            })
            .collect::<Result<Vec<_>>>()?;
        let doc = NetworkDoc {
            hydrograde_network: NETWORK_JSON_VERSION,
            nodes,
            links,
            options: (self.options != NetworkOptions::default()).then(|| self.options.clone()),
        };
        serde_json::to_string_pretty(&doc).map_err(|e| Error::invalid("json", e.to_string()))
    }

    /// Reads a network from a JSON document of schema version [`NETWORK_JSON_VERSION`].
    ///
    /// # Errors
    /// [`Error::Invalid`] on text that is not JSON or not of this schema, a missing or
    /// other version, a node that is neither a junction (`elevation`, optional `outflow`)
    /// nor a fixed head (`head`, optional `elevation`), and every error of the checked
    /// constructors, each naming the node or link.
    pub fn from_json(text: &str) -> Result<Network> {
        #[derive(Deserialize)]
        struct Version {
            hydrograde_network: Option<serde_json::Value>,
        }
        let v: Version = serde_json::from_str(text)
            .map_err(|e| Error::invalid("json", format!("not a network document: {e}")))?;
        match v.hydrograde_network.as_ref().and_then(|x| x.as_u64()) {
            Some(n) if n == u64::from(NETWORK_JSON_VERSION) => {}
            Some(n) => {
                return Err(Error::invalid(
                    "json",
                    format!(
                        "schema version {n} is not supported: this library reads version {NETWORK_JSON_VERSION}"
                    ),
                ));
            }
            None => {
                return Err(Error::invalid(
                    "json",
                    format!(
                        "the document has no \"hydrograde_network\" version field (a whole number; this library reads {NETWORK_JSON_VERSION})"
                    ),
                ));
            }
        }
        let doc: NetworkDoc = serde_json::from_str(text)
            .map_err(|e| Error::invalid("json", format!("not a network document: {e}")))?;
        let mut net = Network::new();
        for (i, n) in doc.nodes.iter().enumerate() {
            let what = format!("node {i} (\"{}\")", n.name);
            match (n.head, n.outflow, n.elevation) {
                (Some(h), None, z) => net.fixed_head(&n.name, h, z),
                (None, o, Some(z)) => net.node(&n.name, z, o.unwrap_or(0.0)),
                (Some(_), Some(_), _) => Err(Error::invalid(
                    "outflow",
                    "a fixed-head node takes no outflow (its flow follows from the solve)",
                )),
                (None, _, None) => Err(Error::invalid(
                    "elevation",
                    "a junction needs an elevation, m (or give \"head\" for a fixed-head node)",
                )),
            }
            .map_err(|e| at(what, e))?;
        }
        for (i, l) in doc.links.into_iter().enumerate() {
            let what = format!("link {i} (\"{}\")", l.name);
            let line: Line = serde_json::from_value(l.line)
                .map_err(|e| at(what.clone(), Error::invalid("line", e.to_string())))?;
            net.link(&l.name, &l.upstream, &l.downstream, line)
                .map_err(|e| at(what, e))?;
        }
        if let Some(o) = doc.options {
            net.set_options(o)
                .map_err(|e| at("options".to_string(), e))?;
        }
        Ok(net)
    }
}
